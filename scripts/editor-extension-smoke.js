#!/usr/bin/env node
// Runs editors/vscode/extension.js outside the editor, against the real `plumb lsp`: a stand-in for
// the editor's API opens FILE, waits for the verdicts, then changes the text (an unclosed unit at
// the end) and waits for that message, asks for a hover at LINE:COL and a definition at LINE:COL
// (0-based), prints what came back and stops the server.
// Usage: node scripts/editor-extension-smoke.js FILE HOVER_LINE HOVER_COL DEF_LINE DEF_COL [LAUNCHER]
// e.g.   node scripts/editor-extension-smoke.js examples/wrong-moonlet.plumb 12 27 12 29
'use strict';
const Module = require('module');
const fs = require('fs');
const path = require('path');

const [file, hl, hc, dl, dc] = process.argv.slice(2, 7);
const launcher = process.argv[7] || path.resolve(__dirname, '..', 'plumb');
const text = fs.readFileSync(file, 'utf8');
let current = text;
const uri = { toString: () => 'file://' + path.resolve(file) };
const doc = { uri, languageId: 'plumb', version: 1, getText: () => current };
const published = [];
const providers = {};
const handlers = {};
const disposable = { dispose() {} };
class Range { constructor(a, b, c, d) { this.start = { line: a, character: b }; this.end = { line: c, character: d }; } }
const vscode = {
  workspace: {
    getConfiguration: (section) => ({ get: (key) => (section === 'plumb' && key === 'launcher' ? launcher : undefined) }),
    workspaceFolders: undefined,
    textDocuments: [doc],
    onDidOpenTextDocument: () => disposable,
    onDidChangeTextDocument: (f) => { handlers.change = f; return disposable; },
    onDidCloseTextDocument: () => disposable,
  },
  languages: {
    createDiagnosticCollection: () => ({ set: (u, d) => published.push(d), delete() {}, dispose() {} }),
    registerHoverProvider: (l, p) => { providers.hover = p; return disposable; },
    registerDefinitionProvider: (l, p) => { providers.definition = p; return disposable; },
  },
  window: {
    createOutputChannel: () => ({ append() {}, appendLine: (m) => console.log('[log]', m), dispose() {} }),
    showErrorMessage: (m) => { console.log('[error]', m); process.exit(1); },
  },
  Uri: { parse: (s) => ({ toString: () => s }) },
  Range,
  Diagnostic: class { constructor(r, m, s) { this.range = r; this.message = m; this.severity = s; } },
  DiagnosticSeverity: { Error: 0, Warning: 1, Information: 2, Hint: 3 },
  Hover: class { constructor(c, r) { this.contents = c; this.range = r; } },
  MarkdownString: class { constructor(v) { this.value = v; } },
  Location: class { constructor(u, r) { this.uri = u; this.range = r; } },
};
const load = Module._load;
Module._load = function (request, ...rest) { return request === 'vscode' ? vscode : load.call(this, request, ...rest); };
const extension = require(path.resolve(__dirname, '..', 'editors', 'vscode', 'extension.js'));
extension.activate({ subscriptions: [] });

function print(title, diagnostics) {
  console.log(title);
  for (const d of diagnostics) console.log(`  ${['error', 'warning', 'info', 'hint'][d.severity]} ${d.range.start.line}:${d.range.start.character} ${d.message.split('\n')[0]}`);
}
const waitFor = (test) => new Promise((resolve) => {
  const timer = setInterval(() => { const last = published[published.length - 1]; if (last && test(last)) { clearInterval(timer); resolve(last); } }, 200);
});

(async () => {
  print('verdicts:', await waitFor((d) => d.some((x) => / (holds|fails|undecided)/.test(x.message))));
  current = text + (text.endsWith('\n') ? '' : '\n') + 'param added [kg\n';
  doc.version = 2;
  handlers.change({ document: doc });
  print('after the change:', await waitFor((d) => d.some((x) => /not closed/.test(x.message))));
  const hover = await providers.hover.provideHover(doc, { line: +hl, character: +hc });
  console.log('hover:', hover ? hover.contents.value.split('\n')[0] : null);
  const where = await providers.definition.provideDefinition(doc, { line: +dl, character: +dc });
  console.log('definition:', where ? where.map((l) => `${l.uri.toString()} ${l.range.start.line}:${l.range.start.character}`).join(', ') : null);
  extension.deactivate();
  setTimeout(() => process.exit(0), 1500);
})();
