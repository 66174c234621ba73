package dev.touchstone.harness.execution;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
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
 * coordinates in words. Numbers are written in their shortest exact form, so a result read
 * back is equal to the one written. Parsing is strict: a line missing a field, or with a
 * value of the wrong type, is refused.
 */
public final class JournalCodec {

    private static final ObjectMapper JSON = new ObjectMapper();

    private JournalCodec() {
    }

    /** One finished run, as read from or written to the journal. */
    public record Line(int run, String coordinates, RunResult result) {
    }

    /** The line's JSON text, without the newline. */
    public static String write(Line line) {
        RunResult r = line.result();
        ObjectNode o = JSON.createObjectNode();
        o.put("key", r.key());
        o.put("run", line.run());
        o.put("coordinates", line.coordinates());
        ObjectNode setting = o.putObject("setting");
        r.setting().coordinates().forEach(setting::put);
        o.put("replicate", r.replicate());
        o.put("configuration", r.configurationId());
        o.put("learner", r.learnerId());
        ObjectNode params = o.putObject("parameters");
        r.parameters().forEach(params::put);
        o.put("seed", r.seed());
        o.put("status", r.status().word());
        o.put("message", r.message());
        o.put("estimate_class", r.estimateClass() == null ? null : r.estimateClass().word());
        o.put("scored_against", r.scoredAgainst() == null ? null : r.scoredAgainst().word());
        ObjectNode metrics = o.putObject("metrics");
        r.metrics().forEach(metrics::put);
        ObjectNode t = o.putObject("timings");
        Timings tm = r.timings();
        t.put("seconds", tm.seconds());
        t.put("cpu_seconds", tm.cpuSeconds());
        t.put("allocated_mb", tm.allocatedMb());
        t.put("tests", tm.tests());
        t.put("scores", tm.scores());
        try {
            return JSON.writeValueAsString(o);
        } catch (JsonProcessingException e) {
            throw new IllegalStateException("a journal line could not be written as JSON", e);
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
        RunResult r = new RunResult(text(o, "key"), new Setting(setting), field(o, "replicate").asInt(),
                text(o, "configuration"), text(o, "learner"), params, field(o, "seed").asLong(),
                RunStatus.parse(text(o, "status")), nullableText(o, "message"),
                graphClass(nullableText(o, "estimate_class")), graphClass(nullableText(o, "scored_against")),
                metrics, timings);
        return new Line(field(o, "run").asInt(), text(o, "coordinates"), r);
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
