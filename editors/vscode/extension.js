// Starts `plumb lsp` for .plumb documents and speaks the Language Server Protocol with it over
// standard input and output. Only the editor's own API and Node's built-in modules are used, so
// nothing has to be installed or fetched: the client carries just what plumb's server offers
// (whole-text synchronisation, published diagnostics, hover, go to definition).
'use strict';

const vscode = require('vscode');
const { spawn } = require('child_process');

let server = null;

function activate(context) {
  const launcher = vscode.workspace.getConfiguration('plumb').get('launcher') || 'plumb';
  server = new Server(launcher, context);
  server.start();
  context.subscriptions.push({ dispose: () => server && server.stop() });
}

function deactivate() {
  if (server) server.stop();
  server = null;
}

class Server {
  constructor(launcher, context) {
    this.launcher = launcher;
    this.context = context;
    this.nextId = 1;
    this.pending = new Map();
    this.buffer = Buffer.alloc(0);
    this.diagnostics = vscode.languages.createDiagnosticCollection('plumb');
    this.output = vscode.window.createOutputChannel('plumb');
    this.versions = new Map();
    context.subscriptions.push(this.diagnostics, this.output);
  }

  start() {
    this.child = spawn(this.launcher, ['lsp'], { stdio: ['pipe', 'pipe', 'pipe'], shell: process.platform === 'win32' });
    this.child.on('error', (e) => vscode.window.showErrorMessage(
      `plumb: could not start '${this.launcher} lsp' (${e.message}); set plumb.launcher to the path of the plumb launcher.`));
    this.child.on('exit', (code) => { if (code) this.output.appendLine(`plumb lsp exited with status ${code}`); });
    this.child.stdin.on('error', (e) => this.output.appendLine(`plumb lsp: ${e.message}`));
    this.child.stderr.on('data', (d) => this.output.append(d.toString()));
    this.child.stdout.on('data', (d) => this.receive(d));

    const root = vscode.workspace.workspaceFolders && vscode.workspace.workspaceFolders[0];
    this.request('initialize', {
      processId: process.pid,
      rootUri: root ? root.uri.toString() : null,
      capabilities: {
        textDocument: {
          synchronization: { didSave: false },
          publishDiagnostics: {},
          hover: { contentFormat: ['markdown', 'plaintext'] },
          definition: {},
        },
      },
    }).then(() => {
      this.notify('initialized', {});
      vscode.workspace.textDocuments.forEach((d) => this.open(d));
    });

    const subs = this.context.subscriptions;
    subs.push(vscode.workspace.onDidOpenTextDocument((d) => this.open(d)));
    subs.push(vscode.workspace.onDidChangeTextDocument((e) => this.change(e.document)));
    subs.push(vscode.workspace.onDidCloseTextDocument((d) => this.close(d)));
    subs.push(vscode.languages.registerHoverProvider('plumb', {
      provideHover: (doc, pos) => this.request('textDocument/hover', position(doc, pos)).then(toHover),
    }));
    subs.push(vscode.languages.registerDefinitionProvider('plumb', {
      provideDefinition: (doc, pos) => this.request('textDocument/definition', position(doc, pos)).then(toLocations),
    }));
  }

  stop() {
    if (!this.child) return;
    const child = this.child;
    this.child = null;
    this.request('shutdown', null, child).then(() => this.notify('exit', null, child), () => child.kill());
    setTimeout(() => child.kill(), 2000).unref();
  }

  open(doc) {
    if (doc.languageId !== 'plumb' || this.versions.has(doc.uri.toString())) return;
    this.versions.set(doc.uri.toString(), doc.version);
    this.notify('textDocument/didOpen', {
      textDocument: { uri: doc.uri.toString(), languageId: 'plumb', version: doc.version, text: doc.getText() },
    });
  }

  change(doc) {
    if (!this.versions.has(doc.uri.toString())) return;
    this.versions.set(doc.uri.toString(), doc.version);
    this.notify('textDocument/didChange', {
      textDocument: { uri: doc.uri.toString(), version: doc.version },
      contentChanges: [{ text: doc.getText() }],
    });
  }

  close(doc) {
    if (!this.versions.delete(doc.uri.toString())) return;
    this.notify('textDocument/didClose', { textDocument: { uri: doc.uri.toString() } });
    this.diagnostics.delete(doc.uri);
  }

  // ---- JSON-RPC over the child's standard streams, each message framed by a Content-Length header ----

  send(message, child = this.child) {
    if (!child) return;
    const body = Buffer.from(JSON.stringify(Object.assign({ jsonrpc: '2.0' }, message)), 'utf8');
    child.stdin.write(`Content-Length: ${body.length}\r\n\r\n`);
    child.stdin.write(body);
  }

  notify(method, params, child) {
    this.send({ method, params }, child);
  }

  request(method, params, child) {
    const id = this.nextId++;
    return new Promise((resolve, reject) => {
      this.pending.set(id, { resolve, reject });
      this.send({ id, method, params }, child);
    });
  }

  receive(data) {
    this.buffer = Buffer.concat([this.buffer, data]);
    for (;;) {
      const headerEnd = this.buffer.indexOf('\r\n\r\n');
      if (headerEnd < 0) return;
      const header = this.buffer.slice(0, headerEnd).toString('ascii');
      const match = /Content-Length: *(\d+)/i.exec(header);
      if (!match) { this.buffer = this.buffer.slice(headerEnd + 4); continue; }
      const length = Number(match[1]);
      if (this.buffer.length < headerEnd + 4 + length) return;
      const body = this.buffer.slice(headerEnd + 4, headerEnd + 4 + length).toString('utf8');
      this.buffer = this.buffer.slice(headerEnd + 4 + length);
      this.dispatch(JSON.parse(body));
    }
  }

  dispatch(message) {
    if (message.method === undefined && this.pending.has(message.id)) {
      const { resolve, reject } = this.pending.get(message.id);
      this.pending.delete(message.id);
      if (message.error) reject(new Error(message.error.message)); else resolve(message.result);
    } else if (message.method === 'textDocument/publishDiagnostics') {
      const uri = vscode.Uri.parse(message.params.uri);
      this.diagnostics.set(uri, message.params.diagnostics.map(toDiagnostic));
    } else if (message.method === 'window/logMessage' || message.method === 'window/showMessage') {
      this.output.appendLine(message.params.message);
    } else if (message.method !== undefined && message.id !== undefined) {
      // A request from the server this small client does not serve: answer it, so the server never waits.
      this.send({ id: message.id, result: null });
    }
  }
}

function position(doc, pos) {
  return { textDocument: { uri: doc.uri.toString() }, position: { line: pos.line, character: pos.character } };
}

function toRange(r) {
  return new vscode.Range(r.start.line, r.start.character, r.end.line, r.end.character);
}

const SEVERITY = [null, vscode.DiagnosticSeverity.Error, vscode.DiagnosticSeverity.Warning,
  vscode.DiagnosticSeverity.Information, vscode.DiagnosticSeverity.Hint];

function toDiagnostic(d) {
  const diagnostic = new vscode.Diagnostic(toRange(d.range), d.message, SEVERITY[d.severity || 1]);
  diagnostic.source = d.source || 'plumb';
  return diagnostic;
}

function toHover(h) {
  if (!h || !h.contents) return null;
  const parts = Array.isArray(h.contents) ? h.contents : [h.contents];
  const text = parts.map((c) => (typeof c === 'string' ? c : c.value)).join('\n\n');
  return new vscode.Hover(new vscode.MarkdownString(text), h.range ? toRange(h.range) : undefined);
}

function toLocations(result) {
  if (!result) return null;
  const list = Array.isArray(result) ? result : [result];
  return list.map((l) => new vscode.Location(vscode.Uri.parse(l.uri || l.targetUri), toRange(l.range || l.targetSelectionRange)));
}

module.exports = { activate, deactivate };
