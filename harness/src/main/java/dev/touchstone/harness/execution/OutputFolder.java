package dev.touchstone.harness.execution;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonToken;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;

/**
 * A study's output folder before anything runs: refused when it is a file, another study's
 * folder or a folder of other things; created when missing; and the copy of the learners file
 * kept in it. Cost: a directory listing and one small read of provenance.
 */
final class OutputFolder {

    private OutputFolder() {
    }

    /** Checks that {@code out} may hold the journal of {@code studyName} and creates it when missing. */
    static void prepare(Path out, String studyName) {
        try {
            if (Files.exists(out) && !Files.isDirectory(out)) {
                throw new StudyRunner.OutputFolderException("the output " + out + " exists and is not a folder");
            }
            String other = recordedStudyName(out);
            if (other != null && !other.equals(studyName)) {
                throw new StudyRunner.OutputFolderException("the folder " + out + " holds the journal of another"
                        + " study ('" + other + "', not '" + studyName + "'); choose another --out");
            }
            if (Files.isDirectory(out) && !Files.exists(out.resolve(Journal.FILE_NAME))) {
                try (Stream<Path> s = Files.list(out)) {
                    if (s.findAny().isPresent()) {
                        throw new StudyRunner.OutputFolderException("the folder " + out + " is not empty and holds no "
                                + Journal.FILE_NAME + ", so it is not a study's output; choose another --out");
                    }
                }
            }
            Files.createDirectories(out);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot prepare the output folder " + out + ": " + e.getMessage(), e);
        }
    }

    /**
     * The name of the study whose journal a folder holds, from its provenance, or null when
     * it holds none (or no readable provenance).
     */
    static String recordedStudyName(Path out) {
        Path prov = out.resolve(StudyRunner.PROVENANCE_FILE);
        if (!Files.exists(out.resolve(Journal.FILE_NAME)) || !Files.isRegularFile(prov)) {
            return null;
        }
        // The streaming parser, not a data-binding mapper: this is on the path of a resume with nothing to do.
        try (JsonParser p = new JsonFactory().createParser(prov.toFile())) {
            if (p.nextToken() != JsonToken.START_OBJECT) {
                return null;
            }
            String name = null;
            while (p.nextToken() == JsonToken.FIELD_NAME) {
                boolean study = p.currentName().equals("study");
                if (study) {
                    name = null;
                }
                if (p.nextToken() == JsonToken.START_OBJECT && study) {
                    while (p.nextToken() == JsonToken.FIELD_NAME) {
                        boolean isName = p.currentName().equals("name");
                        JsonToken t = p.nextToken();
                        if (isName) {
                            name = t == JsonToken.VALUE_STRING ? p.getText() : null;
                        }
                        p.skipChildren();
                    }
                } else {
                    p.skipChildren();
                }
            }
            return name;
        } catch (IOException | RuntimeException e) {
            return null;
        }
    }

    /** Keeps the recipe's learners file in {@code out} (nothing without a recipe or a learners file). */
    static void keepLearnersFile(Path out, RunRecipe recipe) {
        if (recipe == null || recipe.learnersText() == null) {
            return;
        }
        boolean json = recipe.learnersSource().toLowerCase(Locale.ROOT).endsWith(".json");
        OutputFiles.write(out.resolve(StudyRunner.LEARNERS_COPY + (json ? ".json" : ".yaml")), recipe.learnersText());
    }

    /**
     * Whether a session with this recipe would keep no other learners file than the one kept already.
     * Without one it keeps none, and the kept copy stays (the run keys already cover every command the plan uses).
     */
    static boolean sameLearnersCopy(Path out, RunRecipe recipe) {
        if (recipe == null || recipe.learnersText() == null) {
            return true;
        }
        Path kept = keptLearnersFile(out);
        try {
            return kept != null && Files.readString(kept).equals(recipe.learnersText());
        } catch (IOException e) {
            return false;
        }
    }

    /** The copy of the learners file kept in a study's output folder, or null when there is none. */
    static Path keptLearnersFile(Path out) {
        for (String name : learnersCopies()) {
            Path p = out.resolve(name);
            if (Files.isRegularFile(p)) {
                return p;
            }
        }
        return null;
    }

    /** The names the learners copy may have. */
    static List<String> learnersCopies() {
        return List.of(StudyRunner.LEARNERS_COPY + ".yaml", StudyRunner.LEARNERS_COPY + ".json");
    }
}
