package dev.plumb.report;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.util.DefaultIndenter;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.ObjectWriter;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.JsonNodeFactory;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.SortedMap;

/**
 * Writes the JSON of {@code check --format json} and of reports with Jackson: maps (in their own
 * order), lists, arrays of doubles, strings, numbers, booleans and null; anything else as its
 * {@code toString()}. A double is written as Java prints it, which reads back to the same double;
 * NaN and infinities, which JSON cannot hold, become null.
 */
public final class Json {
    private static final JsonNodeFactory NODES = JsonNodeFactory.instance;
    private static final ObjectWriter WRITER = new ObjectMapper().writer(new Layout());

    private Json() {
    }

    /** The value as indented JSON (two spaces, LF line ends), ending in a line feed. */
    public static String write(Object value) {
        try {
            return WRITER.writeValueAsString(node(value)) + "\n";
        } catch (JsonProcessingException e) {
            // A tree of plain nodes always serialises; reaching this is a defect, not an input error.
            throw new IllegalStateException("cannot write JSON: " + e.getOriginalMessage(), e);
        }
    }

    private static JsonNode node(Object v) {
        if (v == null) return NODES.nullNode();
        if (v instanceof String s) return NODES.textNode(s);
        if (v instanceof Double d) return number(d);
        if (v instanceof Float f) return number(f.doubleValue());
        if (v instanceof Integer i) return NODES.numberNode(i);
        if (v instanceof Long l) return NODES.numberNode(l);
        if (v instanceof Short s) return NODES.numberNode(s);
        if (v instanceof Byte b) return NODES.numberNode(b);
        if (v instanceof java.math.BigInteger b) return NODES.numberNode(b);
        if (v instanceof java.math.BigDecimal b) return NODES.numberNode(b);
        if (v instanceof Number n) return number(n.doubleValue());
        if (v instanceof Boolean b) return NODES.booleanNode(b);
        if (v instanceof Map<?, ?> m) {
            ObjectNode o = NODES.objectNode();
            for (Map.Entry<?, ?> e : entries(m)) o.set(String.valueOf(e.getKey()), node(e.getValue()));
            return o;
        }
        if (v instanceof Collection<?> c) {
            ArrayNode a = NODES.arrayNode(c.size());
            c.forEach(x -> a.add(node(x)));
            return a;
        }
        if (v instanceof double[] xs) {
            ArrayNode a = NODES.arrayNode(xs.length);
            for (double x : xs) a.add(number(x));
            return a;
        }
        return NODES.textNode(v.toString());
    }

    private static JsonNode number(double d) {
        return Double.isFinite(d) ? NODES.numberNode(d) : NODES.nullNode();
    }

    /**
     * A map's entries in its own order when it has one (insertion or sorted order); a map whose order
     * is that of its hash table ({@code Map.of}, {@code HashMap}) is written sorted by key, since the
     * order of {@code Map.of} changes from one run of the JVM to the next.
     */
    private static List<Map.Entry<?, ?>> entries(Map<?, ?> m) {
        List<Map.Entry<?, ?>> out = new ArrayList<>(m.entrySet());
        boolean hashed = (m instanceof HashMap && !(m instanceof LinkedHashMap))
                || (!(m instanceof SortedMap) && m.getClass().getName().startsWith("java.util.ImmutableCollections$Map"));
        if (hashed) out.sort((a, b) -> String.valueOf(a.getKey()).compareTo(String.valueOf(b.getKey())));
        return out;
    }

    /** Two-space indentation, LF line ends, {@code "key": value}, every array element on a line of its own. */
    private static final class Layout extends DefaultPrettyPrinter {
        private static final long serialVersionUID = 1L;

        Layout() {
            DefaultIndenter lines = new DefaultIndenter("  ", "\n");
            indentObjectsWith(lines);
            indentArraysWith(lines);
            _objectFieldValueSeparatorWithSpaces = ": ";
        }

        Layout(Layout base) {
            super(base);
        }

        @Override
        public DefaultPrettyPrinter createInstance() {
            return new Layout(this);
        }

        @Override
        public void writeEndObject(JsonGenerator g, int entries) throws IOException {
            // Jackson writes an empty object as "{ }"; the plain "{}" reads better and matches "[]".
            if (entries == 0) {
                _nesting--;
                g.writeRaw('}');
                return;
            }
            super.writeEndObject(g, entries);
        }

        @Override
        public void writeEndArray(JsonGenerator g, int entries) throws IOException {
            if (entries == 0) {
                _nesting--;
                g.writeRaw(']');
                return;
            }
            super.writeEndArray(g, entries);
        }
    }
}
