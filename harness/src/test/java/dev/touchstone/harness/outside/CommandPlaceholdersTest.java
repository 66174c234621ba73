package dev.touchstone.harness.outside;

import dev.touchstone.harness.testing.Python3;
import dev.touchstone.core.data.DataSet;
import dev.touchstone.core.data.Variable;
import dev.touchstone.core.knowledge.Knowledge;
import dev.touchstone.core.learner.LearnerInput;
import dev.touchstone.core.learner.RunContext;
import dev.touchstone.core.param.ParameterValues;
import dev.touchstone.harness.io.KnowledgeFile;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** {@code {kinds}} and {@code {knowledge}} hand an outside command the column kinds and the run's knowledge. */
class CommandPlaceholdersTest {

    @TempDir
    Path tmp;

    @Test
    void theCommandGetsKindsAndKnowledgeFiles() throws IOException {
        String python = Python3.require("the placeholder test");
        Path keep = tmp.resolve("seen");
        Files.createDirectories(keep);
        String script = "import shutil,sys,json,csv; shutil.copy(sys.argv[1], sys.argv[5] + '/kinds.csv');"
                + " shutil.copy(sys.argv[2], sys.argv[5] + '/knowledge.json');"
                + " names = next(csv.reader(open(sys.argv[3])));"
                + " json.dump({'variables': names, 'edges': []}, open(sys.argv[4], 'w'))";
        String yaml = "learners:\n  - id: peek\n    command: [" + python + ", -c, \"" + script + "\", \"{kinds}\","
                + " \"{knowledge}\", \"{data}\", \"{output}\", \"" + keep + "\"]\n    returns: cpdag\n"
                + "    accepts: [continuous, discrete, mixed]\n";
        CommandSpec spec = LearnersFile.read("l.yaml", yaml, tmp).get(0);
        DataSet data = DataSet.builder(4).continuous("x", new double[] {0.5, 1, 2, 3})
                .discrete(Variable.discrete("c", List.of("lo", "hi")), new int[] {0, 1, 1, 0}).build();
        Knowledge k = Knowledge.builder().forbid("c", "x").tier(List.of("x")).tier(List.of("c")).build();
        new CommandLearner(spec).learn(LearnerInput.of(data), k, ParameterValues.none(), RunContext.of(1, null, 1));
        assertEquals("column,kind\nx,continuous\nc,discrete\n", Files.readString(keep.resolve("kinds.csv")));
        Knowledge back = KnowledgeFile.read(keep.resolve("knowledge.json"), data.names());
        assertEquals(k.forbidden(), back.forbidden());
        assertEquals(k.tiers(), back.tiers());
        assertEquals(k.required(), back.required());
    }
}
