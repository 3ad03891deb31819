package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTimeoutPreemptively;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * A catalogue of bad inputs, one row each: what a user in a hurry, a colleague's odd file or a
 * hostile one can hand to {@code plumb check}. Every row states the exit status and where the first
 * error (or the verdict that matters) is reported, line and column, checked exactly; every run must
 * also keep the promises that hold for any input: no exit 3, no internal error, no stack trace, no
 * raw escape character with {@code --no-color}, a summary that agrees with the exit status, and an
 * output of bounded size.
 *
 * <p>Expected places are counted by hand in the input line written beside them (or computed from
 * how the input is built, for the generated ones); the exit statuses are the ones the README states
 * for each kind of outcome (0 holds, 1 a check fails, 2 the input cannot be understood or honoured).
 * Both output streams are read together, so it does not matter which one a message goes to.
 */
class BadInputCatalogueTest {

    /** A generous guard against a hang, not a measure of speed. */
    private static final Duration GUARD = Duration.ofSeconds(300);

    /** No bad input deserves more output than this (a 5 MB line must not be echoed whole). */
    private static final int MOST_OUTPUT = 64 * 1024;

    /** The uniform-density sphere of the README; the line numbers below count its lines 1 to 10. */
    private static final String SPHERE = """
            param M [kg] > 0
            param R [m] > 0
            coord r [m] from 0 to R
            let rho = M / (4/3*pi*R^3)
            let m(r) = 4/3*pi*r^3*rho
            unknown P(r) [Pa]
            relation balance: P'(r) = -G*m(r)*rho/r^2
            boundary surface: P(R) = 0
            claim central: P(0) = 3/(8*pi)*G*M^2/R^4
            case sun: M = 1 [Msun], R = 1 [Rsun]
            """;

    @TempDir
    Path dir;

    // ---- the table --------------------------------------------------------------------------

    static Stream<Entry> catalogue() {
        List<Entry> t = new ArrayList<>();

        // Runaway symbolic work: bounded, ending in a verdict (a short CPU budget per computation keeps the test brief).
        t.add(verdict("power 1e6", "param x > 0\nclaim c: x^1e6 = x\n", 0, "claim", "c", "undecided", 2, 1));
        t.add(verdict("binomial power 1e6", "param x > 0\nclaim c: (1+x)^1000000 = 1\n", 0, "claim", "c", "undecided", 2, 1));
        t.add(verdict("negative power 1e6", "param x > 0\nclaim c: x^(-1e6) = x\n", 0, "claim", "c", "undecided", 2, 1));
        // The derived P(0) is 7500 G M^2/(30001 pi R^4) (integrate P' = -G m rho/r^2 by hand with
        // m = 4/3 pi r^3 rho (r/R)^1.0001): the claimed 3/(8 pi) is 1.50005 times it, so the claim fails.
        t.add(verdict("power 1.0001 of r/R", SPHERE.replace("let m(r) = 4/3*pi*r^3*rho", "let m(r) = 4/3*pi*r^3*rho*(r/R)^1.0001"),
                1, "claim", "central", "fails", 9, 1));
        // claim central: P(0) = R^1e6  -- the right side starts at column 23
        t.add(text("power 1e6 of a radius", SPHERE.replace("3/(8*pi)*G*M^2/R^4", "R^1e6"), 1, 9, 23, "different units"));
        // let m(r) = 4/3*pi*r^R*rho  -- the exponent R at column 21
        t.add(text("exponent with a dimension", SPHERE.replace("r^3*rho", "r^R*rho"), 1, 5, 21, "an exponent must be dimensionless"));

        // Name clashes, in either order.
        t.add(text("parameter then coordinate", "param r > 0\ncoord r [m] from 0 to 1 [m]\n", 2, 2, 7, "'r' is declared twice"));
        t.add(text("coordinate then parameter", "coord r [m] from 0 to 1 [m]\nparam r > 0\n", 2, 2, 7, "'r' is declared twice"));
        t.add(text("parameter then definition", "param x > 0\nlet x = 2\nclaim c: x = x\n", 2, 2, 5, "'x' is declared twice"));
        t.add(text("profile declared twice", "coord r [m] from 0 to 1 [m]\nunknown P(r) [Pa]\nunknown P(r) [Pa]\n", 2, 3, 9,
                "'P' is declared twice"));
        t.add(text("label used twice", "param x > 0\nclaim a: x = x\nclaim a: x = 2*x\n", 2, 3, 7, "the label 'a' is used twice"));
        t.add(text("definitions in a cycle", "let a = b\nlet b = a\nparam x > 0\nclaim c: a = x\n", 2, 1, 5, "cycle"));

        // Deep and wide expressions. "claim c: " is 9 characters: the first '(' is column 10, the 101st column 110;
        // in "x + x + ..." the k-th '+' is at column 4k + 8, the 1,001st at 4012.
        t.add(text("1,500 nested parentheses", "param x > 0\nclaim c: " + "(".repeat(1500) + "x" + ")".repeat(1500) + " = x\n",
                2, 2, 110, "nest more than 100 deep"));
        t.add(text("a sum of 3,000 terms", "param x > 0\nclaim c: x" + " + x".repeat(3000) + " = 3001*x\n",
                2, 2, 4012, "more than 1000 operations"));
        t.add(text("a 5 MB line", "param x > 0\nclaim c: x" + " + x".repeat(1_300_000) + " = x\n",
                2, 2, 4012, "more than 1000 operations"));
        t.add(text("a 5 MB name", "param M [kg] > 0\nclaim c: M = " + "N".repeat(5_000_000) + "\n", 2, 2, 14, "is not defined"));
        t.add(text("a 5 MB unit", "param M [" + "k".repeat(5_000_000) + "] > 0\n", 2, 1, 10, "unknown unit"));
        t.add(text("a 5 MB title", "title \"" + "A".repeat(5_000_000) + "\"\nparam M [kg] > 0\nclaim c: M = N\n",
                2, 3, 14, "'N' is not defined"));

        // Numbers out of range. "param a = " is 10 characters; "claim c: x^" 11; "case sun: M = " 14.
        t.add(text("1e999", "param a = 1e999\n", 2, 1, 11, "beyond the range of double precision"));
        t.add(text("1e-999", "param b = 1e-999\n", 2, 1, 11, "too small to compute with"));
        t.add(text("a subnormal coefficient", "param x > 0\nclaim c: 4.9e-324*x = 0\n", 2, 2, 10, "too small to compute with"));
        t.add(text("an exponent of 1e400", "param x > 0\nclaim c: x^1e400 = x\n", 2, 2, 12, "beyond the range"));
        t.add(text("a 10,000-digit number", "param a = " + "1".repeat(10_000) + "\n", 2, 1, 11, "beyond the range"));
        t.add(text("1e308 Earth masses", "param M = 1e308 [Mearth]\n", 2, 1, 11, "not a finite number in SI units"));
        t.add(text("a case of 1e300 solar masses", SPHERE.replace("M = 1 [Msun]", "M = 1e300 [Msun]"), 2, 10, 15,
                "not a finite number in SI units"));

        // Meaning errors. "case z: M = " is 12 characters; "boundary surface: P(" 20; "expect e: P(" 12;
        // "claim far: P(" 13; "coord r [m] from " 17; "show P(0) in " 13; "case " 5.
        t.add(text("a case value of zero where > 0", SPHERE.replace("case sun: M = 1 [Msun], R = 1 [Rsun]", "case z: M = 0 [kg], R = 1 [m]"),
                2, 10, 13, "but 'M' is declared > 0"));
        t.add(text("a negative case value where > 0", SPHERE.replace("case sun: M = 1 [Msun], R = 1 [Rsun]", "case z: M = -1 [kg], R = 1 [m]"),
                2, 10, 13, "but 'M' is declared > 0"));
        t.add(text("a case without a value", SPHERE.replace(", R = 1 [Rsun]", ""), 2, 10, 6, "gives no value for R"));
        t.add(text("a boundary outside the interval", SPHERE.replace("P(R) = 0", "P(2*R) = 0"), 2, 8, 21,
                "asks for a point outside the interval"));
        t.add(text("an expectation outside the interval", SPHERE + "expect e: P(3*R) at sun = 1 [Pa] within 1%\n", 2, 11, 13,
                "asks for a point outside the interval"));
        t.add(text("a claim outside the interval", SPHERE + "claim far: P(-R) = 0\n", 2, 11, 14, "asks for a point outside the interval"));
        t.add(text("a reversed interval", SPHERE.replace("from 0 to R", "from R to 0"), 2, 3, 18, "runs backwards"));
        t.add(text("a reversed fixed interval", "coord z [m] from 2 [km] to 0 [km]\nunknown P(z) [Pa]\nrelation b: P'(z) = -1 [Pa/m]\n"
                + "boundary g: P(0 [km]) = 1 [atm]\nshow P(1 [km])\n", 2, 1, 18, "runs backwards"));
        t.add(text("an empty interval", SPHERE.replace("from 0 to R", "from R to R"), 2, 3, 18, "is empty"));
        t.add(text("an empty fixed interval", "coord z [m] from 2 [km] to 2 [km]\nunknown P(z) [Pa]\nrelation b: P'(z) = -1 [Pa/m]\n"
                + "boundary g: P(2 [km]) = 1 [atm]\nstep s: P(z) = 1 [atm] - (z - 2 [km])*(1 [Pa/m])\n", 2, 1, 18, "is empty"));
        t.add(text("a value shown in a unit of another kind", SPHERE + "show P(0) in [K]\n", 2, 11, 14, "the units differ"));
        // Two errors: 'x' is no profile, and 'r' is no coordinate (the file declares none).
        t.add(text("a derivative of a parameter, no coordinate", "param x > 0\nclaim c: x'(r) = 1\n", 2, 2, 10,
                "can be differentiated; 'x' is not a function of the coordinate").errors(2));

        // Text as files come: "claim c: M = " is 13 characters, so the undefined N is column 14 on line 2.
        String undefinedN = "param M [kg] > 0\nclaim c: M = N\n";
        t.add(bytes("a byte-order mark", concat(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}, utf8(undefinedN)), 2, 2, 14,
                "'N' is not defined"));
        t.add(text("lone CR line endings", undefinedN.replace('\n', '\r'), 2, 2, 14, "'N' is not defined"));
        t.add(text("CR LF line endings", undefinedN.replace("\n", "\r\n"), 2, 2, 14, "'N' is not defined"));
        t.add(text("a tab before the mistake", "param x > 0\n\tclaim c: x = \ty\n", 2, 2, 16, "'y' is not defined"));
        // An ELF-like header: 24 bytes that are valid UTF-8 (ASCII and NULs), then 0xC0, which never is (RFC 3629).
        byte[] elf = new byte[40];
        byte[] magic = {0x7F, 'E', 'L', 'F', 2, 1, 1, 0};
        System.arraycopy(magic, 0, elf, 0, magic.length);
        elf[24] = (byte) 0xC0;
        t.add(bytes("a binary file", elf, 2, 1, 25, "not UTF-8"));
        // "claim c: x = 1 " is 15 characters; 0xE9 is ISO 8859-1 e-acute, not UTF-8 on its own (RFC 3629).
        t.add(bytes("Latin-1 text with lone CR endings", concat(utf8("param x > 0\rclaim c: x = 1 "), new byte[] {(byte) 0xE9, '\r'}),
                2, 2, 16, "not UTF-8"));
        t.add(text("a run of NUL characters", "param x > 0\n" + "\0".repeat(100) + "\nclaim c: x = x\n", 2, 2, 1, "unexpected character"));
        t.add(text("terminal escapes in the title and a quoted line",
                "title \"\u001b[31mALL HOLD\u001b[0m\"\nparam M [kg] > 0\nclaim c: M = N \u001b[2J\u0007\n", 2, 3, 14, "'N' is not defined")
                .errors(2)); // the undefined N, and the escape sequence with its bell as one run of stray characters
        t.add(text("an empty file", "", 2, 1, 1, "nothing to check"));
        t.add(text("a file of comments only", "# only a comment\n\n", 2, 1, 1, "nothing to check"));
        // "claim c: " is 9 characters: the '(' is column 10, the '=' that should have been a ')' column 17.
        t.add(text("an unclosed parenthesis", "param x > 0\nclaim c: (x + 1 = x\n", 2, 2, 17, "to close the '(' at column 10"));
        t.add(text("an unclosed parenthesis running on", "param x > 0\nclaim c: (x + 1\nparam y > 0\n", 2, 2, 10, "'('"));
        t.add(text("an unclosed string", "title \"no end\nparam x > 0\nclaim c: x = x\n", 2, 1, 7, "string not closed"));
        // "param M [" is 9 characters: the '[' is column 9 and the unit inside it starts at column 10.
        t.add(text("an unknown unit", "param M [kgg] > 0\n", 2, 1, 10, "unknown unit 'kgg'"));
        t.add(text("20,000 erroneous lines", "param M [kg] > 0\n" + "claim c: M = = N\n".repeat(20_000), 2, 2, 14,
                "expected an expression").errors(50));

        // Files that are no text at all.
        t.add(new Entry("a directory", Input.DIRECTORY, List.of(), 2, null, "directory"));
        t.add(new Entry("a file that does not exist", Input.MISSING, List.of(), 2, null, "no such file"));
        t.add(new Entry("an unreadable file", Input.UNREADABLE, List.of(), 2, null, "permission denied"));
        // typeset NAME as "TeX": the name must be declared, the TeX one every report can show.
        // typeset Mstar as "M_\star"  -- the name starts at column 9
        t.add(text("typeset form of an undeclared name", SPHERE + "typeset Mstar as \"M_\\star\"\n", 2, 11, 9, "'Mstar' is not defined"));
        // typeset M as "M_{\odot"  -- the quote is at column 14, the unclosed '{' at column 17
        t.add(text("typeset form with an unclosed brace", SPHERE + "typeset M as \"M_{\\odot\"\n", 2, 11, 17, "braces are unbalanced"));
        // typeset M as "\input{x}"  -- the backslash is at column 15
        t.add(text("typeset form with a command beyond the checked set", SPHERE + "typeset M as \"\\input{x}\"\n", 2, 11, 15,
                "is not a command a typeset form may use"));
        // typeset M "M_0"  -- 'as' is missing where the string starts, column 11
        t.add(text("typeset form without 'as'", SPHERE + "typeset M \"M_0\"\n", 2, 11, 11, "expected 'as'"));
        return t.stream();
    }

    /** Rows whose answer is still wrong in code that another change owns; they join the table when it lands. */
    static Stream<Entry> unclosedUnit() {
        // "param M [" is 9 characters: the '[' is column 9. One error only: no follow-on "unexpected
        // character '>' in a unit" after the one real mistake.
        return Stream.of(text("an unclosed unit", "param M [kg > 0\nparam R [m] > 0\n", 2, 1, 9, "unit not closed").errors(1));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("unclosedUnit")
    void anUnclosedUnitIsOneError(Entry e) throws IOException {
        everyBadInputIsAnsweredWithAPlace(e);
    }

    // ---- the run and the promises that hold for every input ---------------------------------

    @ParameterizedTest(name = "{0}")
    @MethodSource("catalogue")
    void everyBadInputIsAnsweredWithAPlace(Entry e) throws IOException {
        Path file = e.input().materialize(dir.resolve("bad.plumb"));
        List<String> args = new ArrayList<>(List.of("check", "--no-color", "--symbolic-timeout", "1"));
        args.addAll(e.options());
        args.add(file.toString());
        Run run = assertTimeoutPreemptively(GUARD, () -> Run.of(args.toArray(String[]::new)), e.name() + ": still running after " + GUARD);
        String all = run.err() + run.out();

        assertNotEquals(3, run.status(), () -> "exit 3 (internal error): " + head(all));
        assertFalse(all.contains("internal error"), () -> head(all));
        assertFalse(all.toLowerCase().contains("please report"), () -> head(all));
        assertFalse(all.contains("\u001b"), () -> "a raw escape character with --no-color: " + head(all));
        assertFalse(Pattern.compile("[A-Z]\\w*(Exception|Error)\\b|\\n\\s+at [\\w.$]+\\(").matcher(all).find(),
                () -> "stack-trace text: " + head(all));
        assertTrue(all.length() <= MOST_OUTPUT, () -> all.length() + " characters of output: " + head(all));
        if (all.contains("error:")) assertNotEquals(0, run.status(), () -> "an error was printed: " + head(all));
        Matcher summary = Pattern.compile("(\\d+) hold, (\\d+) fail, (\\d+) undecided(, (\\d+) errors?)?").matcher(run.out());
        if (summary.find()) {
            boolean failing = Integer.parseInt(summary.group(2)) > 0 || summary.group(5) != null;
            assertEquals(run.status() != 0, failing, () -> "the summary must agree with the exit status: " + summary.group());
        }

        assertEquals(e.status(), run.status(), () -> head(all));
        if (e.where() instanceof Where.At at) {
            Matcher m = Pattern.compile("(?m)^" + Pattern.quote(file.toString()) + ":(\\d+):(\\d+): error: (.*)$").matcher(run.err() + run.out());
            if (!m.find()) fail("no located error: " + head(all));
            assertEquals(at.line() + ":" + at.column(), m.group(1) + ":" + m.group(2), () -> "the first error: " + m.group());
            assertTrue(m.group(3).contains(e.fragment()), () -> "the first error: " + m.group());
            if (e.errors() >= 0) {
                long errors = Pattern.compile("(?m)^" + Pattern.quote(file.toString()) + ":\\d+:\\d+: error: ").matcher(all).results().count();
                assertEquals(e.errors(), errors, () -> "located errors: " + head(all));
            }
        } else if (e.where() instanceof Where.Verdict v) {
            Map<?, ?> check = checkNamed((Map<?, ?>) JsonReader.read(run.out()), v.kind(), v.label());
            assertEquals(v.status(), check.get("status"), check::toString);
            assertEquals(v.line() + ":" + v.column(), ((Double) check.get("line")).intValue() + ":" + ((Double) check.get("column")).intValue(),
                    check::toString);
        } else {
            // An input that is not a file of text has no line: the message names the file alone.
            Matcher m = Pattern.compile("(?m)^" + Pattern.quote(file.toString()) + ": error: (.*)$").matcher(all);
            if (!m.find()) fail("no message naming the file: " + head(all));
            assertTrue(m.group(1).contains(e.fragment()), () -> m.group());
        }
    }

    private static Map<?, ?> checkNamed(Map<?, ?> json, String kind, String label) {
        for (Object o : (List<?>) json.get("checks")) {
            Map<?, ?> c = (Map<?, ?>) o;
            if (kind.equals(c.get("kind")) && label.equals(c.get("label"))) return c;
        }
        throw new AssertionError("no " + kind + " '" + label + "' among " + json.get("checks"));
    }

    private static String head(String s) {
        return s.length() <= 2000 ? s : s.substring(0, 2000) + "...";
    }

    // ---- rows -------------------------------------------------------------------------------

    /** Where the answer must point: the first error's line and column, a check's verdict, or the file itself (null). */
    sealed interface Where {
        record At(int line, int column) implements Where { }

        record Verdict(String kind, String label, String status, int line, int column) implements Where { }
    }

    /**
     * One bad input and the answer it must get; {@code errors} is how many located errors the output
     * must hold (one per mistake: no follow-ons, no duplicates), or -1 where that is not the point.
     */
    record Entry(String name, Input input, List<String> options, int status, Where where, String fragment, int errors) {
        Entry(String name, Input input, List<String> options, int status, Where where, String fragment) {
            this(name, input, options, status, where, fragment, where instanceof Where.At ? 1 : -1);
        }

        Entry errors(int n) {
            return new Entry(name, input, options, status, where, fragment, n);
        }

        @Override
        public String toString() {
            return name;
        }
    }

    private static Entry text(String name, String text, int status, int line, int column, String fragment) {
        return new Entry(name, Input.of(utf8(text)), List.of(), status, new Where.At(line, column), fragment);
    }

    private static Entry bytes(String name, byte[] bytes, int status, int line, int column, String fragment) {
        return new Entry(name, Input.of(bytes), List.of(), status, new Where.At(line, column), fragment);
    }

    private static Entry verdict(String name, String text, int status, String kind, String label, String verdict, int line, int column) {
        return new Entry(name, Input.of(utf8(text)), List.of("--format", "json"), status,
                new Where.Verdict(kind, label, verdict, line, column), "");
    }

    /** What stands at the path handed to {@code plumb check}. */
    interface Input {
        Path materialize(Path path) throws IOException;

        static Input of(byte[] content) {
            return path -> Files.write(path, content);
        }

        Input DIRECTORY = Files::createDirectory;

        Input MISSING = path -> path;

        Input UNREADABLE = path -> {
            Files.writeString(path, "param x > 0\n");
            Files.setPosixFilePermissions(path, PosixFilePermissions.fromString("---------"));
            // Permissions do not bind the superuser: there is nothing to test then.
            Assumptions.assumeFalse(Files.isReadable(path), "running with rights that read any file");
            return path;
        };
    }

    private static byte[] utf8(String s) {
        return s.getBytes(StandardCharsets.UTF_8);
    }

    private static byte[] concat(byte[] a, byte[] b) {
        byte[] out = java.util.Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, out, a.length, b.length);
        return out;
    }
}
