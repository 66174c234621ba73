package dev.touchstone.harness.execution;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.touchstone.core.graph.GraphClass;
import dev.touchstone.metrics.results.RunResult;
import dev.touchstone.metrics.results.RunStatus;
import dev.touchstone.metrics.results.Setting;
import dev.touchstone.metrics.results.Timings;

import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * The JSON shape of one journal line: a {@link RunResult} with the run's position and
 * coordinates in words, and the versions it was made with ({@code tool_version},
 * {@code learner_version}; absent from lines of builds that did not record them). Numbers
 * are written in their shortest exact form, so a result read back is equal to the one written. Parsing is strict: a line missing a field, or with a
 * value of the wrong type, is refused.
 */
public final class JournalCodec {

    private static final ObjectMapper JSON = new ObjectMapper();

    private JournalCodec() {
    }

    /**
     * One finished run, as read from or written to the journal.
     *
     * @param versions what the run was made with, or null when not recorded (lines written by
     *                 a build that did not record versions, or not yet stamped by the runner)
     */
    public record Line(int run, String coordinates, RunResult result, RunVersions.Stamp versions) {
        public Line(int run, String coordinates, RunResult result) {
            this(run, coordinates, result, null);
        }
    }

    /** The line's JSON text, without the newline. Streams with a generator (no tree): a few microseconds per line. */
    public static String write(Line line) {
        RunResult r = line.result();
        java.io.StringWriter w = new java.io.StringWriter(512);
        try (com.fasterxml.jackson.core.JsonGenerator g = JSON.getFactory().createGenerator(w)) {
            g.writeStartObject();
            g.writeStringField("key", r.key());
            g.writeNumberField("run", line.run());
            g.writeStringField("coordinates", line.coordinates());
            g.writeObjectFieldStart("setting");
            for (Map.Entry<String, String> e : r.setting().coordinates().entrySet()) {
                g.writeStringField(e.getKey(), e.getValue());
            }
            g.writeEndObject();
            g.writeNumberField("replicate", r.replicate());
            g.writeStringField("configuration", r.configurationId());
            g.writeStringField("learner", r.learnerId());
            g.writeObjectFieldStart("parameters");
            for (Map.Entry<String, String> e : r.parameters().entrySet()) {
                g.writeStringField(e.getKey(), e.getValue());
            }
            g.writeEndObject();
            g.writeNumberField("seed", r.seed());
            g.writeStringField("status", r.status().word());
            g.writeStringField("message", r.message());
            g.writeStringField("estimate_class", r.estimateClass() == null ? null : r.estimateClass().word());
            g.writeStringField("scored_against", r.scoredAgainst() == null ? null : r.scoredAgainst().word());
            g.writeObjectFieldStart("metrics");
            for (Map.Entry<String, Double> e : r.metrics().entrySet()) {
                number(g, e.getKey(), e.getValue());
            }
            g.writeEndObject();
            g.writeObjectFieldStart("timings");
            Timings tm = r.timings();
            number(g, "seconds", tm.seconds());
            number(g, "cpu_seconds", tm.cpuSeconds());
            number(g, "allocated_mb", tm.allocatedMb());
            count(g, "tests", tm.tests());
            count(g, "scores", tm.scores());
            g.writeEndObject();
            if (line.versions() != null) {
                g.writeStringField("tool_version", line.versions().tool());
                g.writeStringField("learner_version", line.versions().learner());
            }
            g.writeEndObject();
        } catch (java.io.IOException e) {
            throw new IllegalStateException("a journal line could not be written as JSON", e);
        }
        return w.toString();
    }

    private static void number(com.fasterxml.jackson.core.JsonGenerator g, String name, Double v)
            throws java.io.IOException {
        if (v == null) {
            g.writeNullField(name);
        } else {
            g.writeNumberField(name, v);
        }
    }

    private static void count(com.fasterxml.jackson.core.JsonGenerator g, String name, Long v)
            throws java.io.IOException {
        if (v == null) {
            g.writeNullField(name);
        } else {
            g.writeNumberField(name, v);
        }
    }

    /**
     * Parses one line.
     *
     * @throws IllegalArgumentException saying what is wrong with it
     */
    public static Line read(String text) {
        JsonNode o;
        try {
            o = JSON.readTree(text);
        } catch (JsonProcessingException e) {
            throw new IllegalArgumentException("not valid JSON: " + e.getOriginalMessage());
        }
        if (o == null || !o.isObject()) {
            throw new IllegalArgumentException("not a JSON object");
        }
        Map<String, String> setting = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = field(o, "setting").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            setting.put(e.getKey(), e.getValue().asText());
        }
        Map<String, String> params = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = field(o, "parameters").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            params.put(e.getKey(), e.getValue().asText());
        }
        Map<String, Double> metrics = new LinkedHashMap<>();
        for (Iterator<Map.Entry<String, JsonNode>> it = field(o, "metrics").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            metrics.put(e.getKey(), number(e.getValue(), e.getKey()));
        }
        JsonNode t = field(o, "timings");
        Double tests = number(field(t, "tests"), "tests");
        Double scores = number(field(t, "scores"), "scores");
        Timings timings = new Timings(number(field(t, "seconds"), "seconds"), number(field(t, "cpu_seconds"),
                "cpu_seconds"), number(field(t, "allocated_mb"), "allocated_mb"),
                tests == null ? null : tests.longValue(), scores == null ? null : scores.longValue());
        RunResult r = RunResult.builder().key(text(o, "key")).setting(new Setting(setting))
                .replicate(field(o, "replicate").asInt()).configurationId(text(o, "configuration"))
                .learnerId(text(o, "learner")).parameters(params).seed(field(o, "seed").asLong())
                .status(RunStatus.parse(text(o, "status"))).message(nullableText(o, "message"))
                .estimateClass(graphClass(nullableText(o, "estimate_class")))
                .scoredAgainst(graphClass(nullableText(o, "scored_against"))).metrics(metrics).timings(timings)
                .build();
        RunVersions.Stamp stamp = null;
        if (o.has("tool_version") || o.has("learner_version")) {
            stamp = new RunVersions.Stamp(text(o, "tool_version"), text(o, "learner_version"));
        }
        return new Line(field(o, "run").asInt(), text(o, "coordinates"), r, stamp);
    }

    private static JsonNode field(JsonNode o, String name) {
        JsonNode v = o.get(name);
        if (v == null) {
            throw new IllegalArgumentException("the field '" + name + "' is missing");
        }
        return v;
    }

    private static String text(JsonNode o, String name) {
        JsonNode v = field(o, name);
        if (!v.isTextual()) {
            throw new IllegalArgumentException("the field '" + name + "' is not text");
        }
        return v.asText();
    }

    private static String nullableText(JsonNode o, String name) {
        JsonNode v = field(o, name);
        return v.isNull() ? null : text(o, name);
    }

    private static Double number(JsonNode v, String name) {
        if (v.isNull()) {
            return null;
        }
        if (!v.isNumber()) {
            throw new IllegalArgumentException("the value of '" + name + "' is not a number");
        }
        return v.asDouble();
    }

    private static GraphClass graphClass(String word) {
        return word == null ? null : GraphClass.parse(word);
    }
}
