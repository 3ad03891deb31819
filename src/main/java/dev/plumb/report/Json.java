package dev.plumb.report;

import java.util.Iterator;
import java.util.List;
import java.util.Map;

/** A minimal JSON writer for maps, lists, strings, numbers, booleans and null. */
public final class Json {
    private Json() {
    }

    public static String write(Object value) {
        StringBuilder out = new StringBuilder();
        write(value, out, 0);
        return out.append('\n').toString();
    }

    private static void write(Object v, StringBuilder out, int indent) {
        if (v == null) {
            out.append("null");
        } else if (v instanceof String s) {
            string(s, out);
        } else if (v instanceof Double d) {
            out.append(d.isNaN() || d.isInfinite() ? "null" : number(d));
        } else if (v instanceof Float f) {
            write(f.doubleValue(), out, indent);
        } else if (v instanceof Number || v instanceof Boolean) {
            out.append(v);
        } else if (v instanceof Map<?, ?> m) {
            if (m.isEmpty()) {
                out.append("{}");
                return;
            }
            out.append("{\n");
            Iterator<? extends Map.Entry<?, ?>> it = m.entrySet().iterator();
            while (it.hasNext()) {
                Map.Entry<?, ?> e = it.next();
                pad(out, indent + 1);
                string(String.valueOf(e.getKey()), out);
                out.append(": ");
                write(e.getValue(), out, indent + 1);
                if (it.hasNext()) out.append(',');
                out.append('\n');
            }
            pad(out, indent);
            out.append('}');
        } else if (v instanceof List<?> l) {
            if (l.isEmpty()) {
                out.append("[]");
                return;
            }
            out.append("[\n");
            for (int i = 0; i < l.size(); i++) {
                pad(out, indent + 1);
                write(l.get(i), out, indent + 1);
                if (i + 1 < l.size()) out.append(',');
                out.append('\n');
            }
            pad(out, indent);
            out.append(']');
        } else {
            string(v.toString(), out);
        }
    }

    private static String number(double d) {
        if (d == Math.rint(d) && Math.abs(d) < 1e15) return Long.toString((long) d);
        return Double.toString(d);
    }

    private static void pad(StringBuilder out, int indent) {
        out.append("  ".repeat(indent));
    }

    private static void string(String s, StringBuilder out) {
        out.append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> out.append("\\\"");
                case '\\' -> out.append("\\\\");
                case '\n' -> out.append("\\n");
                case '\r' -> out.append("\\r");
                case '\t' -> out.append("\\t");
                default -> {
                    if (c < 0x20) out.append(String.format("\\u%04x", (int) c));
                    else out.append(c);
                }
            }
        }
        out.append('"');
    }
}
