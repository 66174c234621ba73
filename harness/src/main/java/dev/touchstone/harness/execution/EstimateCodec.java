package dev.touchstone.harness.execution;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.touchstone.core.graph.Graph;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.core.learner.Estimate;

import java.io.IOException;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * The JSON shape of one line of the kept-estimates file ({@code estimates.jsonl}): the run's
 * key, the estimate's graph class, its variables, its edges and the learner's extras. A run
 * that returned no graph (skipped, failed, timed out) still has its line, with the class
 * {@code null}, so that the file holds exactly one line per journal line.
 *
 * <p>Edges are compact: {@code [i, j, "ta"]} is the edge between variables {@code i} and
 * {@code j} (positions in {@code nodes}) with the mark at {@code i} first, then the mark at
 * {@code j}: {@code t} tail, {@code a} arrow, {@code c} circle. So {@code [0, 1, "ta"]} is
 * {@code nodes[0] → nodes[1]}. Numbers are written in their shortest exact form, so an
 * estimate read back equals the one written.
 */
public final class EstimateCodec {

    private static final ObjectMapper JSON = new ObjectMapper();

    private EstimateCodec() {
    }

    /** One line: a run's key and its estimate, or null when the run returned none. */
    public record Kept(String key, Estimate estimate) {
        public Kept {
            java.util.Objects.requireNonNull(key, "key");
        }
    }

    /** The line's JSON text (no newline) for the run {@code key}; {@code estimate} may be null. */
    public static String write(String key, Estimate estimate) {
        StringWriter w = new StringWriter(estimate == null ? 64 : 64 + 16 * estimate.graph().edgeCount()
                + 8 * estimate.graph().size());
        try (JsonGenerator g = JSON.getFactory().createGenerator(w)) {
            g.writeStartObject();
            g.writeStringField("key", key);
            if (estimate == null) {
                g.writeNullField("class");
            } else {
                Graph graph = estimate.graph();
                g.writeStringField("class", estimate.graphClass().word());
                g.writeArrayFieldStart("nodes");
                for (String n : graph.names()) {
                    g.writeString(n);
                }
                g.writeEndArray();
                g.writeArrayFieldStart("edges");
                for (var e : graph.edges()) {
                    g.writeStartArray();
                    g.writeNumber(e.a());
                    g.writeNumber(e.b());
                    g.writeString(String.valueOf(letter(e.atA())) + letter(e.atB()));
                    g.writeEndArray();
                }
                g.writeEndArray();
                g.writeObjectFieldStart("extras");
                for (Map.Entry<String, Double> x : new java.util.TreeMap<>(estimate.extras()).entrySet()) {
                    Double v = x.getValue();
                    if (v == null || !Double.isFinite(v)) {
                        g.writeNullField(x.getKey());
                    } else {
                        g.writeNumberField(x.getKey(), v);
                    }
                }
                g.writeEndObject();
            }
            g.writeEndObject();
        } catch (IOException e) {
            throw new IllegalStateException("an estimate could not be written as JSON", e);
        }
        return w.toString();
    }

    /**
     * Parses one line.
     *
     * @throws IllegalArgumentException saying what is wrong with it
     */
    public static Kept read(String text) {
        JsonNode o;
        try {
            o = JSON.readTree(text);
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException("not valid JSON: " + e.getOriginalMessage());
        }
        if (o == null || !o.isObject()) {
            throw new IllegalArgumentException("not a JSON object");
        }
        JsonNode key = o.get("key");
        if (key == null || !key.isTextual()) {
            throw new IllegalArgumentException("the field 'key' is missing or not text");
        }
        JsonNode cls = o.get("class");
        if (cls == null) {
            throw new IllegalArgumentException("the field 'class' is missing");
        }
        if (cls.isNull()) {
            return new Kept(key.asText(), null);
        }
        GraphClass graphClass = GraphClass.parse(cls.asText());
        List<String> names = new ArrayList<>();
        for (JsonNode n : array(o, "nodes")) {
            names.add(n.asText());
        }
        MutableGraph g = Graph.builder(names);
        for (JsonNode e : array(o, "edges")) {
            if (!e.isArray() || e.size() != 3 || !e.get(0).isInt() || !e.get(1).isInt() || !e.get(2).isTextual()
                    || e.get(2).asText().length() != 2) {
                throw new IllegalArgumentException("an edge is not [i, j, \"marks\"]: " + e);
            }
            int a = e.get(0).asInt();
            int b = e.get(1).asInt();
            if (a < 0 || b < 0 || a >= names.size() || b >= names.size() || a == b) {
                throw new IllegalArgumentException("an edge names no pair of the " + names.size() + " nodes: " + e);
            }
            String marks = e.get(2).asText();
            g.addEdge(a, b, mark(marks.charAt(0)), mark(marks.charAt(1)));
        }
        Map<String, Double> extras = new LinkedHashMap<>();
        JsonNode x = o.get("extras");
        if (x != null && x.isObject()) {
            for (Iterator<Map.Entry<String, JsonNode>> it = x.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> f = it.next();
                if (!f.getValue().isNull()) {
                    if (!f.getValue().isNumber()) {
                        throw new IllegalArgumentException("the extra '" + f.getKey() + "' is not a number");
                    }
                    extras.put(f.getKey(), f.getValue().asDouble());
                }
            }
        }
        return new Kept(key.asText(), new Estimate(g.freeze(), graphClass, extras));
    }

    /** The key of a line, read without decoding the graph (for reconciling with the journal). */
    static String key(String text) {
        try {
            var p = JSON.getFactory().createParser(text);
            if (p.nextToken() != com.fasterxml.jackson.core.JsonToken.START_OBJECT) {
                throw new IllegalArgumentException("not a JSON object");
            }
            if (p.nextToken() != com.fasterxml.jackson.core.JsonToken.FIELD_NAME || !"key".equals(p.getCurrentName())
                    || p.nextToken() != com.fasterxml.jackson.core.JsonToken.VALUE_STRING) {
                throw new IllegalArgumentException("the line does not start with its key");
            }
            return p.getText();
        } catch (IOException e) {
            throw new IllegalArgumentException("not valid JSON: " + e.getMessage());
        }
    }

    private static JsonNode array(JsonNode o, String name) {
        JsonNode v = o.get(name);
        if (v == null || !v.isArray()) {
            throw new IllegalArgumentException("the field '" + name + "' is missing or not a list");
        }
        return v;
    }

    private static char letter(Mark m) {
        switch (m) {
            case TAIL: return 't';
            case ARROW: return 'a';
            default: return 'c';
        }
    }

    private static Mark mark(char c) {
        switch (c) {
            case 't': return Mark.TAIL;
            case 'a': return Mark.ARROW;
            case 'c': return Mark.CIRCLE;
            default: throw new IllegalArgumentException("unknown mark letter '" + c + "' (allowed: t, a, c)");
        }
    }
}
