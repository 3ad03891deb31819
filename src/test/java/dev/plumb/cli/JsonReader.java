package dev.plumb.cli;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A strict reader for the JSON that plumb writes, so tests look at fields rather than at text:
 * objects become maps, arrays lists, numbers doubles. Anything malformed throws.
 */
final class JsonReader {
    private final String s;
    private int pos;

    private JsonReader(String s) {
        this.s = s;
    }

    static Object read(String text) {
        JsonReader r = new JsonReader(text);
        Object v = r.value();
        r.space();
        if (r.pos != text.length()) throw new IllegalArgumentException("trailing text at " + r.pos);
        return v;
    }

    private Object value() {
        space();
        char c = s.charAt(pos);
        if (c == '{') return object();
        if (c == '[') return array();
        if (c == '"') return string();
        if (s.startsWith("true", pos)) return literal("true", Boolean.TRUE);
        if (s.startsWith("false", pos)) return literal("false", Boolean.FALSE);
        if (s.startsWith("null", pos)) return literal("null", null);
        return number();
    }

    private Object literal(String word, Object v) {
        pos += word.length();
        return v;
    }

    private Map<String, Object> object() {
        Map<String, Object> m = new LinkedHashMap<>();
        pos++;
        space();
        if (s.charAt(pos) == '}') {
            pos++;
            return m;
        }
        while (true) {
            space();
            String key = string();
            space();
            expect(':');
            if (m.put(key, value()) != null) throw new IllegalArgumentException("duplicate key " + key);
            space();
            if (s.charAt(pos) == '}') {
                pos++;
                return m;
            }
            expect(',');
        }
    }

    private List<Object> array() {
        List<Object> l = new ArrayList<>();
        pos++;
        space();
        if (s.charAt(pos) == ']') {
            pos++;
            return l;
        }
        while (true) {
            l.add(value());
            space();
            if (s.charAt(pos) == ']') {
                pos++;
                return l;
            }
            expect(',');
        }
    }

    private String string() {
        expect('"');
        StringBuilder out = new StringBuilder();
        while (s.charAt(pos) != '"') {
            char c = s.charAt(pos++);
            if (c == '\\') {
                char e = s.charAt(pos++);
                switch (e) {
                    case 'n' -> out.append('\n');
                    case 't' -> out.append('\t');
                    case 'r' -> out.append('\r');
                    case 'u' -> {
                        out.append((char) Integer.parseInt(s.substring(pos, pos + 4), 16));
                        pos += 4;
                    }
                    default -> out.append(e);
                }
            } else {
                out.append(c);
            }
        }
        pos++;
        return out.toString();
    }

    private Double number() {
        int start = pos;
        while (pos < s.length() && "+-0123456789.eE".indexOf(s.charAt(pos)) >= 0) pos++;
        if (start == pos) throw new IllegalArgumentException("unexpected '" + s.charAt(pos) + "' at " + pos);
        return Double.parseDouble(s.substring(start, pos));
    }

    private void expect(char c) {
        if (s.charAt(pos) != c) throw new IllegalArgumentException("expected '" + c + "' at " + pos + ", found '" + s.charAt(pos) + "'");
        pos++;
    }

    private void space() {
        while (pos < s.length() && Character.isWhitespace(s.charAt(pos))) pos++;
    }
}
