package dev.plumb.cli;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;

/**
 * Inputs for fuzzing the command line, each a pure function of a seed and an index so that any one
 * can be made again from its number: shipped derivations with a few mutations, and random streams
 * of the language's words. The text is cut into tokens here by a pattern of its own, not by the
 * project's lexer, so a mistake in the lexer cannot hide itself from the mutations.
 */
final class FuzzInputs {

    /** One generated input: its bytes as written to the file, and how it was made (for a failure report). */
    record Input(long index, String kind, byte[] bytes, List<String> args) {
        String text() {
            return new String(bytes, StandardCharsets.UTF_8);
        }
    }

    private static final Pattern TOKEN = Pattern.compile(
            "\\[[^\\]\\n]*\\]?|\"[^\"\\n]*\"?|#[^\\n]*|(?:\\d+\\.?\\d*|\\.\\d+)(?:[eE][+-]?\\d+)?"
                    + "|[\\p{L}_][\\p{L}\\p{N}_]*|\\n|[ \\t]+|<=|>=|\\+-|.", Pattern.DOTALL);

    static final List<String> KEYWORDS = List.of("title", "param", "coord", "let", "unknown", "relation", "boundary",
            "step", "claim", "scaling", "case", "expect", "show", "sweep", "guess", "from", "to", "at", "within", "in",
            "if", "then", "else", "max", "min", "over", "log", "linear");
    static final List<String> NAMES = List.of("M", "R", "r", "P", "m", "rho", "rho_c", "K", "n", "x", "z", "T", "T0",
            "L", "H", "g", "y", "theta", "xi", "ρ", "Mm", "E", "I", "N", "D", "C", "u", "w", "sun", "earth", "a1");
    static final List<String> BUILTINS = List.of("pi", "π", "e", "G", "c", "h", "hbar", "k_B", "m_u", "m_e", "m_p",
            "N_A", "R_gas", "sigma_SB", "g_n", "sqrt", "exp", "log", "ln", "log10", "sin", "cos", "tan", "asin",
            "acos", "atan", "sinh", "cosh", "tanh", "asinh", "acosh", "atanh", "abs");
    static final List<String> NUMBERS = List.of("0", "1", "2", "3", "-1", "0.5", "1.5", "4/3", "1e308", "1e-320",
            "4.9e-324", "1e999", "1e-999", "1.7976931348623157e308", "2.2250738585072014e-308", "0.0", "000",
            "1e6", "1000000", "1e-12", "0.999999999", "1.0001", "123456789012345678901234567890", "6.674e-11",
            "1e+308", "9e15", ".5", "5.", "1e", "1e+", "12.5.3");
    static final List<String> UNITS = List.of("[kg]", "[m]", "[Pa]", "[s]", "[1]", "[]", "[km]", "[Msun]", "[Rsun]",
            "[g/cm^3]", "[kg/m^3]", "[kg^(-4/3)]", "[m^(1/0)]", "[m^99999999999]", "[m^(1/3)^(3/2)]", "[foo]",
            "[kg m]", "[K]", "[mol]", "[m/s^2]", "[dyn/cm^2]", "[Pa^(1/2)]", "[m^-3]", "[kg/(m s^2)]", "[(((m)))]",
            "[kg ^]", "[GPa]", "[bar]", "[atm]", "[au]", "[Mearth]", "[J/(mol K)]", "[m^3 kg^-1 s^-2]", "[",
            "[m", "[m]]", "[kg*kg*kg*kg]", "[1e3 m]", "[%]", "[m^0]", "[m^(0/0)]");
    static final List<String> OPERATORS = List.of("+", "-", "*", "/", "^", "(", ")", ",", ":", "=", "~", "%", "'",
            "<", "<=", ">", ">=", "+-", "±", "''", "[", "]", "\"", "#", "\n", "\n", "\n");
    static final List<String> STRANGE = List.of("\u0000", "\u0001", "\u0007", "\u001b[31m", "\t", "\r", "\r\n",
            "\u00a0", "\u200b", "\ufeff", "\u202e", "\ud83d\ude00", "é", "ρ", "∂", "±", "π", "√", "≤", "∞",
            "\u0085", "\u2028", "\\", "@", "$", "`", "{", "}", ";", "!", "&", "|", "?");

    /** A shipped derivation to mutate: its file name and text. */
    record Shipped(String name, String text) {
    }

    private final List<Shipped> seeds;
    private final long seed;

    FuzzInputs(List<Shipped> seeds, long seed) {
        if (seeds.isEmpty()) throw new IllegalArgumentException("no seed derivations");
        this.seeds = List.copyOf(seeds);
        this.seed = seed;
    }

    /** The shipped derivations and examples, read from the project folder (the tests' working directory). */
    static List<Shipped> shippedDerivations() {
        List<Shipped> texts = new ArrayList<>();
        for (String dir : List.of("derivations", "examples")) {
            try (Stream<Path> files = Files.list(Path.of(dir))) {
                for (Path f : files.filter(p -> p.toString().endsWith(".plumb")).sorted().toList()) {
                    texts.add(new Shipped(f.toString(), Files.readString(f, StandardCharsets.UTF_8)));
                }
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }
        return texts;
    }

    /**
     * How the inputs are shared out: {@code mutated} of them are mutated shipped derivations, {@code written}
     * small derivations written from scratch, the rest streams of random words.
     */
    record Mix(double mutated, double written) {
    }

    /** Input number {@code index}. */
    Input input(long index, Mix mix) {
        Random random = new Random(scramble(seed * 1_000_003L + index));
        double draw = random.nextDouble();
        boolean mutated = draw < mix.mutated();
        String kind;
        byte[] bytes;
        if (mutated) {
            Shipped which = seeds.get(random.nextInt(seeds.size()));
            StringBuilder how = new StringBuilder("mutated " + which.name() + ", operations");
            String text = mutate(which.text(), random, how);
            bytes = text.getBytes(StandardCharsets.UTF_8);
            if (random.nextInt(40) == 0) {
                bytes = withInvalidByte(bytes, random);
                how.append(" invalid-byte");
            }
            kind = how.toString();
        } else {
            boolean shaped = draw < mix.mutated() + mix.written();
            kind = shaped ? "written" : "tokens";
            bytes = (shaped ? written(random) : tokens(random)).getBytes(StandardCharsets.UTF_8);
        }
        List<String> args = random.nextInt(8) == 0 ? List.of("--format", "json") : List.of("--no-color");
        return new Input(index, kind, bytes, args);
    }

    /** SplitMix64's finaliser: java.util.Random's first outputs for neighbouring seeds are close together. */
    private static long scramble(long z) {
        z = (z ^ (z >>> 30)) * 0xbf58476d1ce4e5b9L;
        z = (z ^ (z >>> 27)) * 0x94d049bb133111ebL;
        return z ^ (z >>> 31);
    }

    static List<String> tokenize(String text) {
        List<String> out = new ArrayList<>();
        Matcher m = TOKEN.matcher(text);
        while (m.find()) out.add(m.group());
        return out;
    }

    private static String mutate(String text, Random random, StringBuilder how) {
        List<String> tokens = tokenize(text);
        int count = 1 + random.nextInt(random.nextInt(4) == 0 ? 8 : 3);
        for (int i = 0; i < count && !tokens.isEmpty(); i++) {
            Mutation op = Mutation.values()[random.nextInt(Mutation.values().length)];
            how.append(' ').append(op.name().toLowerCase(java.util.Locale.ROOT));
            tokens = mutateOnce(tokens, op, random);
        }
        return String.join("", tokens);
    }

    /** What one mutation does to the tokens of a derivation. */
    private enum Mutation {
        DELETE_TOKEN, DUPLICATE_TOKEN, SWAP_TOKENS, LINE, EXTREME_NUMBER, BRACKET, FLIP_OPERATOR, CHANGE_UNIT, RENAME,
        TRUNCATE, STRANGE_CHARACTER, ODD_NUMBER, INSERT_WORD, REPEAT_LINE, DEEP_OR_WIDE, INSERT_POWER, INSERT_KEYWORD
    }

    private static List<String> mutateOnce(List<String> tokens, Mutation op, Random random) {
        List<String> t = new ArrayList<>(tokens);
        int at = random.nextInt(t.size());
        switch (op) {
            case DELETE_TOKEN -> t.remove(at);
            case DUPLICATE_TOKEN -> t.add(at, t.get(at));
            case SWAP_TOKENS -> swap(t, at, random.nextBoolean() ? Math.min(t.size() - 1, at + 1) : random.nextInt(t.size()));
            case LINE -> { // delete, duplicate or swap a whole line
                List<List<String>> lines = lines(t);
                int l = random.nextInt(lines.size());
                switch (random.nextInt(3)) {
                    case 0 -> lines.remove(l);
                    case 1 -> lines.add(l, lines.get(l));
                    default -> java.util.Collections.swap(lines, l, random.nextInt(lines.size()));
                }
                t = join(lines);
            }
            case EXTREME_NUMBER -> replaceOne(t, random, FuzzInputs::isNumber, pick(NUMBERS, random));
            case BRACKET -> t.add(at, pick(List.of("(", ")", "[", "]", "((", "))", "(((((((((("), random));
            case FLIP_OPERATOR -> replaceOne(t, random, s -> FLIPS.containsKey(s), null);
            case CHANGE_UNIT -> replaceOne(t, random, s -> s.startsWith("["), pick(UNITS, random));
            case RENAME -> rename(t, random);
            case TRUNCATE -> { // at a random character
                String s = String.join("", t);
                t = tokenize(s.substring(0, random.nextInt(s.length() + 1)));
            }
            case STRANGE_CHARACTER -> t.add(at, pick(STRANGE, random));
            case ODD_NUMBER -> replaceOne(t, random, FuzzInputs::isNumber, pick(List.of("1e6", "1000000", "0.999999999",
                    "1.0001", "1e308", "(1e6)", "R", "r", "(-1/2)", "1/3"), random));
            case INSERT_WORD -> t.add(at, " " + vocabulary(random) + " ");
            case REPEAT_LINE -> { // many times
                List<List<String>> lines = lines(t);
                int l = random.nextInt(lines.size());
                int times = 2 + random.nextInt(random.nextInt(10) == 0 ? 3000 : 50);
                for (int k = 0; k < times; k++) lines.add(l, lines.get(l));
                t = join(lines);
            }
            case DEEP_OR_WIDE -> { // deep nesting or a wide sum at a token
                boolean deep = random.nextBoolean();
                int n = 1 + random.nextInt(random.nextInt(5) == 0 ? 3000 : 120);
                t.add(at, deep ? "(".repeat(n) + "x" + ")".repeat(random.nextInt(n + 1)) : "x + ".repeat(n));
            }
            case INSERT_POWER -> t.add(at, random.nextBoolean() ? "^1e6" : "^" + pick(List.of("R", "r", "1.0001",
                    "0.999999999", "1000000", "(1/3)", "-1e9", "M", "x"), random));
            case INSERT_KEYWORD -> t.add(at, " " + pick(KEYWORDS, random) + " ");
        }
        return t;
    }

    private static final java.util.Map<String, String> FLIPS = java.util.Map.ofEntries(
            java.util.Map.entry("+", "-"), java.util.Map.entry("-", "+"), java.util.Map.entry("*", "/"),
            java.util.Map.entry("/", "*"), java.util.Map.entry("^", "*"), java.util.Map.entry("=", "~"),
            java.util.Map.entry("~", "="), java.util.Map.entry("<", ">="), java.util.Map.entry(">", "<="),
            java.util.Map.entry("<=", ">"), java.util.Map.entry(">=", "<"), java.util.Map.entry(":", "="),
            java.util.Map.entry(",", ";"), java.util.Map.entry("(", "["), java.util.Map.entry(")", "]"));

    private static void replaceOne(List<String> t, Random random, java.util.function.Predicate<String> which, String with) {
        List<Integer> places = new ArrayList<>();
        for (int i = 0; i < t.size(); i++) if (which.test(t.get(i))) places.add(i);
        if (places.isEmpty()) return;
        int i = places.get(random.nextInt(places.size()));
        t.set(i, with != null ? with : FLIPS.get(t.get(i)));
    }

    /** Renames one identifier everywhere (or once) to another name of the file, a built-in or a keyword: clashes. */
    private static void rename(List<String> t, Random random) {
        List<String> names = t.stream().filter(FuzzInputs::isName).distinct().toList();
        if (names.isEmpty()) return;
        String from = pick(names, random);
        String to = switch (random.nextInt(4)) {
            case 0 -> pick(names, random);
            case 1 -> pick(BUILTINS, random);
            case 2 -> pick(KEYWORDS, random);
            default -> pick(NAMES, random);
        };
        boolean everywhere = random.nextBoolean();
        for (int i = 0; i < t.size(); i++) {
            if (t.get(i).equals(from)) {
                t.set(i, to);
                if (!everywhere) return;
            }
        }
    }

    private static byte[] withInvalidByte(byte[] bytes, Random random) {
        int at = random.nextInt(bytes.length + 1);
        byte[] out = new byte[bytes.length + 1];
        System.arraycopy(bytes, 0, out, 0, at);
        out[at] = (byte) (int) pick(List.of(0xff, 0xc3, 0x80, 0xfe, 0xed), random);
        System.arraycopy(bytes, at, out, at + 1, bytes.length - at);
        return out;
    }

    /** A stream of words of the language, lines of 1 to 20 tokens in no particular order. */
    private static String tokens(Random random) {
        StringBuilder s = new StringBuilder();
        int lines = 1 + random.nextInt(12);
        for (int l = 0; l < lines; l++) {
            int n = 1 + random.nextInt(20);
            for (int i = 0; i < n; i++) s.append(vocabulary(random)).append(random.nextInt(4) == 0 ? "" : " ");
            s.append('\n');
        }
        return s.toString();
    }

    private static String vocabulary(Random random) {
        return switch (random.nextInt(10)) {
            case 0, 1 -> pick(KEYWORDS, random);
            case 2, 3 -> pick(NAMES, random);
            case 4 -> pick(BUILTINS, random);
            case 5 -> pick(NUMBERS, random);
            case 6 -> pick(UNITS, random);
            case 7 -> random.nextInt(5) == 0 ? pick(STRANGE, random) : "\"" + pick(NAMES, random) + "\"";
            default -> pick(OPERATORS, random);
        };
    }

    /**
     * A small derivation written from scratch: a radius, dimensionless parameters, a profile whose unit
     * is inferred, and equations that use only declared names, with odd numbers, units and exponents
     * here and there, so that many get past the parser and the checker to the symbolic and numeric stages.
     */
    private static String written(Random random) {
        List<String> names = new ArrayList<>(List.of("a", "x(r)"));
        StringBuilder s = new StringBuilder();
        if (random.nextInt(3) == 0) s.append("title \"").append(pick(NAMES, random)).append("\"\n");
        s.append("param R [m] > 0\n");
        s.append("param a").append(random.nextInt(8) == 0 ? " = " + number(random) : " > 0").append('\n');
        if (random.nextBoolean()) {
            s.append("param b = ").append(number(random)).append('\n');
            names.add("b");
        }
        s.append("coord r [m] from ").append(random.nextInt(6) == 0 ? number(random) + " [m]" : "0")
                .append(" to ").append(random.nextInt(6) == 0 ? number(random) + "*R" : "R").append('\n');
        s.append("let x(r) = r/R\n");
        boolean profile = random.nextInt(5) != 0;
        if (profile) {
            s.append("unknown P(r)\n");
            s.append("relation balance: P'(r) = (").append(expr(names, random, 3)).append(")/R\n");
            s.append("boundary ").append(pick(List.of("surface: P(R)", "centre: P(0)"), random)).append(" = ")
                    .append(random.nextBoolean() ? pick(List.of("0", "1"), random) : expr(names, random, 1)).append('\n');
            names.addAll(List.of("P(r)", "P(0)"));
        }
        int equations = random.nextInt(4);
        for (int i = 0; i < equations; i++) {
            s.append(pick(List.of("claim ", "step "), random)).append("c").append(i).append(": ")
                    .append(profile && random.nextBoolean() ? pick(List.of("P(0)", "P(r)", "P'(r)*R"), random) : expr(names, random, 3))
                    .append(" = ").append(expr(names, random, 3)).append('\n');
        }
        if (random.nextInt(3) == 0) {
            s.append("scaling sc: ").append(profile ? "P(0)" : expr(names, random, 1)).append(" ~ ")
                    .append(expr(names, random, 2)).append('\n');
        }
        if (random.nextBoolean()) {
            s.append("case body: R = ").append(number(random)).append(' ').append(pick(List.of("[km]", "[m]", "[Rsun]", "[kg]"), random));
            if (!s.toString().contains("param a =")) s.append(", a = ").append(number(random));
            s.append('\n');
            if (profile && random.nextBoolean()) {
                s.append("expect e: P(").append(random.nextBoolean() ? "0" : pick(List.of("R", "R/2", "2*R"), random))
                        .append(") at body = ").append(number(random)).append(" within ").append(number(random)).append("%\n");
            }
        }
        if (random.nextBoolean()) s.append("show ").append(profile ? "P(0)" : expr(names, random, 2)).append('\n');
        List<String> lines = new ArrayList<>(s.toString().lines().toList());
        if (random.nextInt(4) == 0) {
            // a stray line: a statement of random words
            lines.add(random.nextInt(lines.size() + 1), tokens(random).lines().findFirst().orElse(""));
        }
        return String.join("\n", lines) + "\n";
    }

    private static String number(Random random) {
        return random.nextInt(8) == 0 ? pick(NUMBERS, random) : pick(List.of("1", "2", "0.5", "3", "6371", "7.3e22", "1e5"), random);
    }

    private static String maybe(Random random, String text) {
        return random.nextBoolean() ? text : "";
    }

    private static String expr(List<String> names, Random random, int depth) {
        if (depth <= 0 || random.nextInt(3) == 0) {
            return switch (random.nextInt(6)) {
                case 0, 1, 2 -> pick(names, random);
                case 3, 4 -> number(random);
                default -> random.nextInt(8) == 0 ? number(random) + " " + pick(UNITS, random) : pick(List.of("pi", "2*pi", "sqrt(2)"), random);
            };
        }
        return switch (random.nextInt(10)) {
            case 0 -> expr(names, random, depth - 1) + " + " + expr(names, random, depth - 1);
            case 1 -> expr(names, random, depth - 1) + " - " + expr(names, random, depth - 1);
            case 2, 3 -> expr(names, random, depth - 1) + "*" + expr(names, random, depth - 1);
            case 4 -> expr(names, random, depth - 1) + "/" + expr(names, random, depth - 1);
            case 5 -> expr(names, random, depth - 1) + "^" + (random.nextInt(3) == 0 ? expr(names, random, depth - 1)
                    : pick(List.of("2", "3", "-1", "(1/3)", "0.5", "1e6", "1.0001", "(-3/2)"), random));
            case 6 -> pick(List.of("sqrt", "exp", "log", "sin", "abs", "tanh", "atan"), random) + "(" + expr(names, random, depth - 1) + ")";
            case 7 -> "-" + expr(names, random, depth - 1);
            case 8 -> "if x(r) < " + expr(names, random, depth - 1) + " then " + expr(names, random, depth - 1)
                    + " else " + expr(names, random, depth - 1);
            default -> "(" + expr(names, random, depth - 1) + ")";
        };
    }

    private static List<List<String>> lines(List<String> tokens) {
        List<List<String>> lines = new ArrayList<>();
        List<String> current = new ArrayList<>();
        for (String tok : tokens) {
            current.add(tok);
            if (tok.equals("\n")) {
                lines.add(current);
                current = new ArrayList<>();
            }
        }
        if (!current.isEmpty()) lines.add(current);
        return lines;
    }

    private static List<String> join(List<List<String>> lines) {
        List<String> t = new ArrayList<>();
        for (List<String> l : lines) t.addAll(l);
        return t;
    }

    private static void swap(List<String> t, int i, int j) {
        java.util.Collections.swap(t, i, j);
    }

    private static boolean isNumber(String s) {
        return !s.isEmpty() && (Character.isDigit(s.charAt(0)) || s.charAt(0) == '.' && s.length() > 1);
    }

    private static boolean isName(String s) {
        return !s.isEmpty() && (Character.isLetter(s.charAt(0)) || s.charAt(0) == '_');
    }

    private static <T> T pick(List<T> list, Random random) {
        return list.get(random.nextInt(list.size()));
    }
}
