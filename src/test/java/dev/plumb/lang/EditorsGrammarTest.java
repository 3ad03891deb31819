package dev.plumb.lang;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.plumb.model.BuiltinFunction;
import dev.plumb.units.Constants;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Keeps the editor files in {@code editors/} in step with the language: the TextMate grammar's
 * patterns compile, colour every statement keyword the parser accepts, every built-in function and
 * constant, and, on every shipped file, put the unit, string, number and comment scopes exactly where
 * the lexer finds units, strings, numbers and comments. The grammar is applied as a TextMate editor
 * does on one line: from the current position the pattern whose match starts first wins, ties going
 * to the pattern listed first.
 */
class EditorsGrammarTest {

    private static final ObjectMapper JSON = new ObjectMapper();
    private static final Path EDITORS = Path.of("editors");
    private static JsonNode grammar;
    private static List<Rule> rules;

    /** A match rule: its pattern, the scope of the whole match (or null) and the scope of each group. */
    record Rule(Pattern pattern, String name, Map<Integer, String> captures) { }

    /** A scoped piece of a line, [start, end) in chars. */
    record Piece(int start, int end, String scope) { }

    @BeforeAll
    static void load() throws IOException {
        grammar = JSON.readTree(EDITORS.resolve("plumb.tmLanguage.json").toFile());
        rules = new ArrayList<>();
        for (JsonNode p : grammar.get("patterns")) flatten(p, rules, 0);
    }

    private static void flatten(JsonNode rule, List<Rule> out, int depth) {
        assertTrue(depth < 10, "includes nest too deep");
        if (rule.has("include")) {
            String ref = rule.get("include").asText();
            assertTrue(ref.startsWith("#"), "only repository includes are used: " + ref);
            JsonNode target = grammar.get("repository").get(ref.substring(1));
            assertTrue(target != null, "no repository entry " + ref);
            for (JsonNode p : target.get("patterns")) flatten(p, out, depth + 1);
            return;
        }
        assertTrue(rule.has("match") && !rule.has("begin"), "every rule is a one-line match rule: " + rule);
        Map<Integer, String> captures = new java.util.TreeMap<>();
        if (rule.has("captures")) {
            rule.get("captures").fields().forEachRemaining(e -> captures.put(Integer.parseInt(e.getKey()), e.getValue().get("name").asText()));
        }
        out.add(new Rule(Pattern.compile(rule.get("match").asText()), rule.has("name") ? rule.get("name").asText() : null, captures));
    }

    /** The scoped pieces of one line, as a TextMate editor finds them with the top-level patterns. */
    static List<Piece> tokenize(String line) {
        List<Piece> pieces = new ArrayList<>();
        int pos = 0;
        while (pos <= line.length()) {
            Matcher best = null;
            Rule bestRule = null;
            for (Rule r : rules) {
                Matcher m = r.pattern().matcher(line);
                if (m.find(pos) && (best == null || m.start() < best.start())) {
                    best = m;
                    bestRule = r;
                }
            }
            if (best == null) break;
            if (bestRule.name() != null) pieces.add(new Piece(best.start(), best.end(), bestRule.name()));
            for (Map.Entry<Integer, String> c : bestRule.captures().entrySet()) {
                if (best.group(c.getKey()) != null) pieces.add(new Piece(best.start(c.getKey()), best.end(c.getKey()), c.getValue()));
            }
            pos = best.end() > best.start() ? best.end() : best.start() + 1;
        }
        return pieces;
    }

    private static List<Piece> scoped(List<Piece> pieces, String prefix) {
        return pieces.stream().filter(p -> p.scope().startsWith(prefix)).toList();
    }

    @Test
    void everyRegexCompilesAndTheNamesAreTheLanguagesOwn() {
        assertEquals("source.plumb", grammar.get("scopeName").asText());
        assertEquals("plumb", grammar.get("fileTypes").get(0).asText());
        List<String> regexes = new ArrayList<>();
        grammar.findValues("match").forEach(n -> regexes.add(n.asText()));
        assertTrue(regexes.size() > 20, "the grammar has its patterns: " + regexes.size());
        for (String r : regexes) Pattern.compile(r);
        for (Rule r : rules) {
            if (r.name() != null) assertTrue(r.name().endsWith(".plumb"), r.name());
            r.captures().values().forEach(s -> assertTrue(s.endsWith(".plumb"), s));
        }
    }

    @Test
    void theExtensionShipsTheSameGrammarAndStartsTheLanguageServer() throws IOException {
        Path ext = EDITORS.resolve("vscode");
        assertArrayEquals(Files.readAllBytes(EDITORS.resolve("plumb.tmLanguage.json")),
                Files.readAllBytes(ext.resolve("syntaxes/plumb.tmLanguage.json")), "the extension's copy of the grammar is the grammar");
        JsonNode manifest = JSON.readTree(ext.resolve("package.json").toFile());
        assertFalse(manifest.has("dependencies"), "the extension needs nothing installed or fetched");
        JsonNode language = manifest.at("/contributes/languages/0");
        assertEquals("plumb", language.get("id").asText());
        assertEquals(".plumb", language.get("extensions").get(0).asText());
        JsonNode config = JSON.readTree(ext.resolve(language.get("configuration").asText()).toFile());
        assertEquals("#", config.at("/comments/lineComment").asText());
        JsonNode grammarEntry = manifest.at("/contributes/grammars/0");
        assertEquals("plumb", grammarEntry.get("language").asText());
        assertEquals(grammar.get("scopeName").asText(), grammarEntry.get("scopeName").asText());
        assertTrue(Files.isRegularFile(ext.resolve(grammarEntry.get("path").asText())));
        Path main = ext.resolve(manifest.get("main").asText());
        String code = Files.readString(main);
        JsonNode setting = manifest.at("/contributes/configuration/properties/plumb.launcher");
        assertEquals("plumb", setting.get("default").asText(), "the default launcher is plumb on PATH");
        assertTrue(code.contains("'plumb'") && code.contains("get('launcher'"), "extension.js reads the launcher setting");
        assertTrue(code.contains("['lsp']"), "extension.js starts '<launcher> lsp'");
        assertFalse(code.contains("require('vscode-languageclient"), "no library to install");
    }

    @Test
    void everyStatementKeywordOfTheParserIsColouredAtTheStartOfALine() {
        assertTrue(Parser.STATEMENTS.contains("typeset") && Parser.STATEMENTS.size() >= 16, Parser.STATEMENTS.toString());
        for (String keyword : Parser.STATEMENTS) {
            for (String indent : new String[] {"", "  "}) {
                List<Piece> pieces = tokenize(indent + keyword + " x");
                assertTrue(pieces.contains(new Piece(indent.length(), indent.length() + keyword.length(), "keyword.other.statement.plumb")),
                        keyword + ": " + pieces);
            }
            // Only the word itself: a longer name that begins like it is no keyword.
            assertTrue(scoped(tokenize(keyword + "s x"), "keyword.other.statement").isEmpty(), keyword + "s");
        }
    }

    @Test
    void everyBuiltInFunctionAndConstantIsColoured() {
        for (BuiltinFunction f : BuiltinFunction.values()) {
            String line = "let y = 2*" + f.word + "(x)";
            assertTrue(tokenize(line).contains(new Piece(10, 10 + f.word.length(), "support.function.builtin.plumb")), line + ": " + tokenize(line));
        }
        List<String> constants = new ArrayList<>(Constants.all().keySet());
        constants.add("\u03c0");
        for (String c : constants) {
            String line = "let y = 2*" + c + "*x";
            assertTrue(tokenize(line).contains(new Piece(10, 10 + c.length(), "support.constant.plumb")), line + ": " + tokenize(line));
            // Part of a longer name it is not the constant.
            assertTrue(scoped(tokenize("let y = 2*" + c + "_1*x"), "support.constant").isEmpty(), c + "_1");
        }
    }

    @Test
    void labelsPrimesAndAssumptionsHaveTheirScopes() {
        List<Piece> p = tokenize("relation balance: P'(r) = -G*m(r)*rho/r^2");
        assertTrue(p.contains(new Piece(9, 16, "entity.name.label.plumb")), p.toString());
        assertTrue(p.contains(new Piece(18, 19, "variable.function.plumb")), p.toString());
        assertTrue(p.contains(new Piece(19, 20, "keyword.operator.prime.plumb")), p.toString());
        p = tokenize("param Rc [m] > 0, < R");
        assertTrue(p.contains(new Piece(13, 16, "meta.assumption.sign.plumb")), p.toString());
        assertTrue(p.contains(new Piece(18, 19, "keyword.operator.comparison.plumb")), p.toString());
        p = tokenize("expect heaviest: max m(R) over family = 2.0 [Msun] within 0.1%");
        assertTrue(p.contains(new Piece(17, 20, "keyword.other.extremum.plumb")), p.toString());
        assertTrue(p.contains(new Piece(26, 30, "keyword.other.plumb")), p.toString());
        p = tokenize("sweep family: rho_c from 1e17 [kg/m^3] to 1e20 [kg/m^3] log 40");
        assertTrue(p.contains(new Piece(56, 59, "keyword.other.spacing.plumb")), p.toString());
        assertTrue(scoped(p, "support.function").isEmpty(), "log N is not the function log: " + p);
    }

    /** Each shipped line, coloured as an editor would, against what the lexer makes of the same text. */
    @Test
    void shippedFilesAreColouredWhereTheLexerFindsUnitsStringsNumbersAndComments() throws IOException {
        List<Path> files = new ArrayList<>();
        for (String dir : new String[] {"derivations", "examples"}) {
            try (Stream<Path> s = Files.list(Path.of(dir))) {
                s.filter(f -> f.toString().endsWith(".plumb")).sorted().forEach(files::add);
            }
        }
        assertTrue(files.size() > 40, "the shipped files: " + files.size());
        int units = 0, comments = 0;
        for (Path file : files) {
            String text = Files.readString(file, StandardCharsets.UTF_8);
            String[] lines = text.split("\n", -1);
            List<Token> tokens = new Lexer(text, new Diagnostics()).tokens();
            List<List<Piece>> coloured = new ArrayList<>();
            for (String line : lines) coloured.add(tokenize(line));
            boolean statementStart = true;
            Token previous = null;
            for (Iterator<Token> it = tokens.iterator(); it.hasNext(); ) {
                Token t = it.next();
                Span s = t.span();
                String where = file + ":" + s.line() + ":" + s.column() + " " + t.describe();
                if (t.is(TokenType.NEWLINE) || t.is(TokenType.EOF)) {
                    statementStart = true;
                    continue;
                }
                List<Piece> pieces = coloured.get(s.line() - 1);
                Piece exact = new Piece(s.column() - 1, s.endColumn() - 1, "");
                String expected = switch (t.type()) {
                    case UNIT -> "support.type.unit.plumb";
                    case STRING -> "string.quoted.double.plumb";
                    case NUMBER -> "constant.numeric.plumb";
                    case IDENT -> statementStart && Parser.STATEMENTS.contains(t.text()) ? "keyword.other.statement.plumb" : null;
                    case COLON -> previous != null && previous.is(TokenType.IDENT) ? "punctuation" : null;
                    default -> null;
                };
                if (expected != null) {
                    assertTrue(pieces.contains(new Piece(exact.start(), exact.end(), expected))
                                    || expected.equals("punctuation") && pieces.stream().anyMatch(p -> p.start() == exact.start() && p.scope().startsWith("punctuation")),
                            where + " should be " + expected + ": " + pieces);
                }
                if (t.is(TokenType.UNIT)) units++;
                statementStart = false;
                previous = t;
            }
            // Both ways: every unit, string and number the grammar colours is one the lexer found.
            for (int i = 0; i < lines.length; i++) {
                int line = i + 1;
                List<Token> onLine = tokens.stream().filter(t -> t.span().line() == line).toList();
                for (String[] kind : new String[][] {{"support.type.unit.plumb", "UNIT"}, {"string.quoted.double.plumb", "STRING"},
                        {"constant.numeric.plumb", "NUMBER"}}) {
                    for (Piece p : scoped(coloured.get(i), kind[0])) {
                        assertTrue(onLine.stream().anyMatch(t -> t.type().name().equals(kind[1]) && t.span().column() - 1 == p.start()
                                && t.span().endColumn() - 1 == p.end()), file + ":" + line + " coloured " + p + " is no " + kind[1] + " token");
                    }
                }
                // A comment starts at the first '#' outside every token and runs to the end of the line.
                int hash = -1;
                for (int c = lines[i].indexOf('#'); c >= 0 && hash < 0; c = lines[i].indexOf('#', c + 1)) {
                    int col = c + 1;
                    if (onLine.stream().noneMatch(t -> t.span().column() <= col && col < t.span().endColumn())) hash = c;
                }
                List<Piece> commentPieces = scoped(coloured.get(i), "comment.");
                if (hash < 0) {
                    assertTrue(commentPieces.isEmpty(), file + ":" + line + " has no comment: " + commentPieces);
                } else {
                    assertEquals(List.of(new Piece(hash, lines[i].length(), "comment.line.number-sign.plumb")), commentPieces, file + ":" + line);
                    comments++;
                }
                assertTrue(scoped(coloured.get(i), "invalid.").isEmpty(), file + ":" + line + ": " + coloured.get(i));
            }
        }
        assertTrue(units > 500 && comments > 100, "units " + units + ", comments " + comments);
    }

    @Test
    void unclosedUnitsAndStringsAreMarked() {
        assertEquals(List.of(new Piece(8, 15, "invalid.illegal.unclosed-unit.plumb")), scoped(tokenize("param M [kg > 0"), "invalid"));
        assertEquals(1, scoped(tokenize("title \"open"), "invalid.illegal.unclosed-string").size());
        if (tokenize("param M [kg] > 0").isEmpty()) fail("nothing coloured");
    }
}
