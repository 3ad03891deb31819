package dev.plumb.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;

import dev.plumb.report.Json;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** The JSON writer, read back with the tests' own strict reader (which parses numbers with {@code Double.parseDouble}). */
class JsonWriterTest {

    @SuppressWarnings("unchecked")
    private static Map<String, Object> read(String json) {
        return (Map<String, Object>) assertInstanceOf(Map.class, JsonReader.read(json));
    }

    @Test
    void doublesReadBackToTheSameBitsAndNonFiniteOnesAreNull() {
        List<Double> values = new ArrayList<>(List.of(0.1 + 0.2, 1.0 / 3, Double.MIN_VALUE, Double.MAX_VALUE, -0.0, 1e17, 1e-300,
                6.67430e-11, 1.3446551699484189E14, 2.0, -4.0, 123456789012345678.0));
        Random random = new Random(7);
        for (int i = 0; i < 2000; i++) values.add(Double.longBitsToDouble(random.nextLong()));
        values.removeIf(v -> !Double.isFinite(v));
        Map<String, Object> doc = new LinkedHashMap<>();
        doc.put("values", values);
        doc.put("array", new double[] {Math.PI, Math.E});
        doc.put("nan", Double.NaN);
        doc.put("infinite", Double.NEGATIVE_INFINITY);
        Map<String, Object> back = read(Json.write(doc));
        List<?> read = assertInstanceOf(List.class, back.get("values"));
        assertEquals(values.size(), read.size());
        for (int i = 0; i < values.size(); i++) {
            assertEquals(Double.doubleToLongBits(values.get(i)), Double.doubleToLongBits((Double) read.get(i)), "value " + values.get(i));
        }
        assertEquals(List.of(Math.PI, Math.E), back.get("array"));
        assertNull(back.get("nan"));
        assertNull(back.get("infinite"));
    }

    @Test
    void keysKeepTheirInsertionOrderAndHashedMapsComeOutSorted() {
        Map<String, Object> doc = new LinkedHashMap<>();
        doc.put("file", "x.plumb");
        doc.put("ok", true);
        doc.put("checks", List.of(Map.of("zeta", 1, "alpha", 2, "mid", 3, "beta", 4)));
        Map<String, Object> hashed = new HashMap<>();
        for (String k : List.of("R", "M", "G", "rho_c", "K")) hashed.put(k, 1);
        doc.put("exponents", hashed);
        doc.put("empty", Map.of());
        doc.put("none", List.of());
        doc.put("text", "quote \" backslash \\ newline \n tab \t control \u0001 unicode ρ");
        String json = Json.write(doc);
        assertEquals(List.of("file", "ok", "checks", "exponents", "empty", "none", "text"), List.copyOf(read(json).keySet()));
        @SuppressWarnings("unchecked")
        Map<String, Object> check = (Map<String, Object>) ((List<Object>) read(json).get("checks")).get(0);
        assertEquals(List.of("alpha", "beta", "mid", "zeta"), List.copyOf(check.keySet()));
        assertEquals(List.of("G", "K", "M", "R", "rho_c"), List.copyOf(((Map<?, ?>) read(json).get("exponents")).keySet()));
        assertEquals(doc.get("text"), read(json).get("text"));
        Map<String, Object> small = new LinkedHashMap<>();
        small.put("a", List.of(1, Map.of()));
        small.put("b", List.of());
        // Two-space indentation, "key": value, one element a line, empty ones closed up, a final line feed.
        assertEquals("{\n  \"a\": [\n    1,\n    {}\n  ],\n  \"b\": []\n}\n", Json.write(small));
    }
}
