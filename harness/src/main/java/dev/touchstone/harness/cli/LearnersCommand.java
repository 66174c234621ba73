package dev.touchstone.harness.cli;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import dev.touchstone.core.data.DataKind;
import dev.touchstone.core.learner.KnowledgeUse;
import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.harness.catalog.LearnerCatalog;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

/** {@code touchstone learners}: lists every learner with what it declares, from the same descriptors studies are checked with. */
@Command(name = "learners", description = "List every learner and what it declares.")
final class LearnersCommand implements Callable<Integer> {

    @Option(names = "--json", description = "Print JSON instead of text.")
    boolean json;

    @Mixin
    LearnerSourceOptions sources;

    @picocli.CommandLine.Spec
    picocli.CommandLine.Model.CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        PrintWriter out = spec.commandLine().getOut();
        LearnerCatalog catalog = sources.toolkit().learners;
        if (json) {
            ObjectMapper m = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
            ArrayNode list = m.createArrayNode();
            for (LearnerCatalog.Entry e : catalog.entries()) {
                list.add(describe(m, e));
            }
            out.println(m.writeValueAsString(list));
        } else if (catalog.entries().isEmpty()) {
            out.println("no learners found");
        } else {
            for (LearnerCatalog.Entry e : catalog.entries()) {
                LearnerDescription d = e.learner().description();
                out.printf(Locale.ROOT, "%s  (%s, %s; returns %s; accepts %s)%n", d.id(), d.family().word(),
                        e.origin().word(), d.returns().word(), kinds(d));
                out.println("    " + d.summary());
                out.println("    publication: " + d.publication());
                out.println("    missing values: " + word(d.missingValues().name()) + "; oracle: " + d.oracle().word()
                        + "; knowledge: " + (d.knowledge().isEmpty() ? "none" : knowledge(d))
                        + (d.takesStartGraph() ? "; can start from a given graph" : ""));
                for (String a : d.assumptions()) {
                    out.println("    assumes: " + a);
                }
                for (ParameterSpec p : d.parameters()) {
                    out.printf(Locale.ROOT, "    %s (%s, default %s, allowed %s): %s%n", p.name(), p.type().word(),
                            p.defaultValue(), p.allowed(), p.meaning());
                }
            }
        }
        out.flush();
        return Main.DONE;
    }

    private static ObjectNode describe(ObjectMapper m, LearnerCatalog.Entry e) {
        LearnerDescription d = e.learner().description();
        ObjectNode o = m.createObjectNode();
        o.put("id", d.id());
        o.put("origin", e.origin().word());
        o.put("source", e.source());
        o.put("summary", d.summary());
        o.put("publication", d.publication());
        o.put("family", d.family().word());
        ArrayNode acc = o.putArray("accepts");
        for (DataKind k : d.accepts()) {
            acc.add(k.word());
        }
        o.put("returns", d.returns().word());
        o.put("missing_values", word(d.missingValues().name()));
        ArrayNode kn = o.putArray("knowledge");
        for (KnowledgeUse k : d.knowledge()) {
            kn.add(word(k.name()));
        }
        o.put("oracle", d.oracle().word());
        o.put("takes_start_graph", d.takesStartGraph());
        ArrayNode as = o.putArray("assumptions");
        d.assumptions().forEach(as::add);
        ArrayNode ps = o.putArray("parameters");
        for (ParameterSpec p : d.parameters()) {
            ObjectNode po = ps.addObject();
            po.put("name", p.name());
            po.put("type", p.type().word());
            po.putPOJO("default", p.defaultValue());
            po.put("allowed", p.allowed());
            if (p.min() != null && Double.isFinite(p.min())) {
                po.put("min", p.min());
            }
            if (p.max() != null && Double.isFinite(p.max())) {
                po.put("max", p.max());
            }
            if (!p.choices().isEmpty()) {
                ArrayNode ch = po.putArray("choices");
                p.choices().forEach(ch::add);
            }
            po.put("meaning", p.meaning());
        }
        return o;
    }

    private static String kinds(LearnerDescription d) {
        List<String> w = new ArrayList<>();
        for (DataKind k : d.accepts()) {
            w.add(k.word());
        }
        return String.join(", ", w);
    }

    private static String knowledge(LearnerDescription d) {
        List<String> w = new ArrayList<>();
        for (KnowledgeUse k : d.knowledge()) {
            w.add(word(k.name()));
        }
        return String.join(", ", w);
    }

    static String word(String enumName) {
        return enumName.toLowerCase(Locale.ROOT).replace('_', '-');
    }
}
