package dev.touchstone.harness.cli;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.nio.file.attribute.FileTime;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code report} on a finished study reads no more than its {@code finished.json} while that
 * index still vouches for the report, and renders again as soon as anything it vouches for
 * changed (the rule of file fingerprints is common practice for build tools, see
 * {@code FinishedIndex}).
 */
class ReportFromIndexTest {

    @TempDir
    Path tmp;

    private static final String STUDY = String.join("\n", "name: small", "seed: 3", "replicates: 3",
            "truth:", "  graph: {family: erdos-renyi, nodes: 4, mean_degree: 1}", "  model: {kind: linear-gaussian}",
            "samples: [50]", "learners: [empty]", "metrics: [shd]", "");

    private Path finishedStudy() throws IOException {
        Path study = tmp.resolve("s.yaml");
        Files.writeString(study, STUDY);
        Path out = tmp.resolve("out");
        CliTest.Result r = CliTest.cli("run", study.toString(), "--out", out.toString(), "--quiet");
        assertEquals(0, r.status(), r.err());
        return out;
    }

    /** Puts the report's modification time well in the past, so a rewrite shows as a new time. */
    private static FileTime age(Path file) throws IOException {
        FileTime old = FileTime.fromMillis(Files.getLastModifiedTime(file).toMillis() - 60_000);
        Files.setLastModifiedTime(file, old);
        return old;
    }

    @Test
    @DisplayName("report on a finished study with a vouched report rewrites nothing and does not read the journal")
    void currentReportIsLeftAlone() throws IOException {
        Path out = finishedStudy();
        Path html = out.resolve("report.html");
        String before = Files.readString(html);
        FileTime written = Files.getLastModifiedTime(html);
        // The run's index vouches for the report as it is. A journal that cannot be decoded proves the
        // journal is not read: the marker's check of an untouched file is its size and time only.
        Path journal = out.resolve("journal.jsonl");
        FileTime journalTime = Files.getLastModifiedTime(journal);
        byte[] bytes = Files.readAllBytes(journal);
        byte[] garbled = bytes.clone();
        for (int i = 0; i < garbled.length; i++) {
            garbled[i] = garbled[i] == '\n' ? (byte) '\n' : (byte) '#';
        }
        Files.write(journal, garbled);
        Files.setLastModifiedTime(journal, journalTime);
        CliTest.Result again = CliTest.cli("report", out.toString());
        assertEquals(0, again.status(), again.err());
        assertEquals(written, Files.getLastModifiedTime(html), "the current report is not rewritten");
        assertTrue(again.out().contains("report: "), again.out());
        assertEquals(before, Files.readString(html));
        Files.write(journal, bytes);
        Files.setLastModifiedTime(journal, journalTime);
    }

    @Test
    @DisplayName("report renders again when the journal changed after the study finished, or goes elsewhere")
    void changedJournalOrOtherFolderRendersAgain() throws IOException {
        Path out = finishedStudy();
        CliTest.Result first = CliTest.cli("report", out.toString());
        assertEquals(0, first.status(), first.err());
        Path html = out.resolve("report.html");

        CliTest.Result elsewhere = CliTest.cli("report", out.toString(), "--out", tmp.resolve("other").toString());
        assertEquals(0, elsewhere.status(), elsewhere.err());
        assertEquals(Files.readString(out.resolve("report.md")), Files.readString(tmp.resolve("other/report.md")),
                "a report elsewhere is rendered from the journal, with the same tables");

        FileTime old = age(html);
        Path journal = out.resolve("journal.jsonl");
        List<String> lines = new ArrayList<>(Files.readAllLines(journal));
        lines.set(0, lines.get(0).substring(0, lines.get(0).length() / 2));
        Files.write(journal, lines);
        CliTest.Result refused = CliTest.cli("report", out.toString());
        assertEquals(2, refused.status(), "a changed journal is decoded with all its checks: " + refused.out());
        assertTrue(refused.err().startsWith("error: ") && refused.err().contains("journal.jsonl:1:"), refused.err());
        assertEquals(old, Files.getLastModifiedTime(html), "a refused report leaves the old one");
    }
}
