package dev.touchstone.harness.study;

import com.fasterxml.jackson.dataformat.yaml.YAMLMapper;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The block-YAML writer of the normalised study text ({@link BlockYaml}), checked against an
 * outside reader: Jackson's YAML module (a general-purpose library) must read every written
 * tree back to the same values of the same types. The strings are the cases YAML 1.1 and 1.2
 * read as something else when plain (booleans, nulls, numbers, dates, indicators; from the
 * YAML 1.2 specification §5.3 and §7.3.3 and the YAML 1.1 boolean type, from memory) and
 * characters that must be escaped inside double quotes.
 */
class BlockYamlTest {

    private static final List<String> STRINGS = List.of("", " lead", "trail ", "yes", "No", "ON", "off", "y", "N",
            "null", "Null", "~", "true", "FALSE", "1", "-1", "1.5", "0x1F", "0o17", "1e3", "1_000", ".inf", "-.inf",
            ".NaN", "NaN", "Infinity", "-", "- x", "a: b", "a:b", "a #b", "#c", "[x]", "{y}", "x,y", "&a", "*b", "!t",
            "|", ">", "'s'", "\"d\"", "back\\slash", "line\nbreak", "tab\tx", "cr\rx", "ctl\u0001x", "del\u007f",
            "nel\u0085x", "ls\u2028x", "bom\ufeffx", "é ünïcödé", "emoji \ud83d\ude00", "2019-01-01", "12:30:00",
            "@at", "`tick", "%p", "?q", "<<", "=", "/abs/path/g.json", "C:\\dir\\g.csv", "plain_word",
            "with-dash.and+plus/slash", "erdos-renyi", "a very long description that goes well past eighty characters"
                    + " so that a folding writer would have split it over lines");

    private static Object readBack(String text) throws Exception {
        return new YAMLMapper().readValue(text, Object.class);
    }

    @Test
    @DisplayName("every tricky string reads back as the same string, as a value and as a key")
    void strings() throws Exception {
        Map<String, Object> values = new LinkedHashMap<>();
        Map<String, Object> keys = new LinkedHashMap<>();
        for (int i = 0; i < STRINGS.size(); i++) {
            values.put("s" + i, STRINGS.get(i));
            keys.put(STRINGS.get(i), i);
        }
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("values", values);
        root.put("keys", keys);
        root.put("list", new ArrayList<>(STRINGS));
        assertEquals(root, readBack(BlockYaml.text(root)), BlockYaml.text(root));
    }

    @Test
    @DisplayName("numbers and booleans read back with their values and types; reals always as reals")
    void numbers() throws Exception {
        Map<String, Object> root = new LinkedHashMap<>();
        List<Object> reals = List.of(2.0, 0.0001, 1e10, 1e-10, -0.0, 0.0, 4.9E-324, Double.MAX_VALUE, 1.0 / 3, -7.25);
        root.put("reals", reals);
        root.put("ints", List.of(0, 7, -3, Integer.MAX_VALUE, Integer.MIN_VALUE));
        root.put("longs", List.of(5_000_000_000L, Long.MIN_VALUE));
        root.put("bools", List.of(true, false));
        String text = BlockYaml.text(root);
        Object back = readBack(text);
        assertEquals(root, back, text);
        for (Object r : (List<?>) ((Map<?, ?>) back).get("reals")) {
            assertTrue(r instanceof Double, r + " read back as " + r.getClass());
        }
    }

    @Test
    @DisplayName("nested maps and lists, empty ones and lists of lists keep their shape")
    void shapes() throws Exception {
        Map<String, Object> step = new LinkedHashMap<>();
        step.put("use", "pc");
        step.put("with", new LinkedHashMap<>(Map.of("alpha", List.of(0.01, 0.05))));
        step.put("given", "start-graph");
        Map<String, Object> entry = new LinkedHashMap<>();
        entry.put("id", "two-step");
        entry.put("steps", List.of(step, new LinkedHashMap<>(Map.of("use", "ges"))));
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("truth", List.of(new LinkedHashMap<>(Map.of("graph", new LinkedHashMap<>(Map.of("family",
                List.of("chain", "star"))))), new LinkedHashMap<>(Map.of("network", "sprinkler"))));
        root.put("learners", List.of(entry));
        root.put("empty_list", List.of());
        root.put("empty_map", Map.of());
        root.put("grid", List.of(List.of(1, 2), List.of(List.of(3), 4)));
        root.put("nothing", null);
        String text = BlockYaml.text(root);
        assertEquals(root, readBack(text), text);
    }

    @Test
    @DisplayName("the layout: lists at their key's indentation, a list item's map starting on the item's line")
    void layout() {
        Map<String, Object> entry = new LinkedHashMap<>();
        entry.put("id", "e");
        entry.put("use", "empty");
        Map<String, Object> root = new LinkedHashMap<>();
        root.put("name", "r");
        root.put("truth", new LinkedHashMap<>(Map.of("graph", new LinkedHashMap<>(Map.of("nodes", 10)))));
        root.put("samples", List.of(100));
        root.put("learners", List.of(entry));
        assertEquals("name: r\ntruth:\n  graph:\n    nodes: 10\nsamples:\n- 100\nlearners:\n- id: e\n  use: empty\n",
                BlockYaml.text(root));
    }
}
