package dev.touchstone.harness.io;

import dev.touchstone.core.knowledge.Knowledge;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class KnowledgeFileTest {

    private static final List<String> DATA = List.of("age", "smoking", "tar", "cancer", "sex");

    @TempDir
    Path dir;

    private Path file(String name, String text) throws IOException {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    private String refused(String name, String text) throws IOException {
        Path f = file(name, text);
        return assertThrows(FileFormatException.class, () -> KnowledgeFile.read(f, DATA)).getMessage();
    }

    @Test
    void readsYaml() throws IOException {
        Path f = file("k.yaml", "# what the clinic knows\n"
                + "required:\n  - [smoking, tar]\n"
                + "forbidden: [[tar, smoking]]\n"
                + "tiers:\n  - [age, sex]\n  - [smoking]\n  - [tar, cancer]\n");
        Knowledge k = KnowledgeFile.read(f, DATA);
        assertTrue(k.isRequired("smoking", "tar"));
        assertTrue(k.isForbidden("tar", "smoking"));
        assertTrue(k.isForbidden("cancer", "age"));
        assertFalse(k.isForbidden("age", "cancer"));
        assertEquals(List.of(List.of("age", "sex"), List.of("smoking"), List.of("tar", "cancer")), k.tiers());
    }

    @Test
    void readsJsonAndEmptyFiles() throws IOException {
        Path f = file("k.json", "{\"required\": [[\"age\", \"cancer\"]], \"tiers\": []}");
        Knowledge k = KnowledgeFile.read(f, DATA);
        assertTrue(k.isRequired("age", "cancer"));
        String empty = assertThrows(FileFormatException.class, () -> KnowledgeFile.read(file("empty.yaml", ""), DATA))
                .getMessage();
        assertTrue(empty.endsWith("empty.yaml: the file is empty (give at least one of required, forbidden and tiers,"
                + " or leave the knowledge file out)"), empty);
        String trailing = assertThrows(FileFormatException.class,
                () -> KnowledgeFile.read(file("t.json", "{\"tiers\": []} {}"), DATA)).getMessage();
        assertTrue(trailing.contains("unexpected content after the end of the knowledge"), trailing);
        assertTrue(KnowledgeFile.read(file("nulls.yaml", "required:\nforbidden:\n"), DATA).isEmpty());
        assertTrue(KnowledgeFile.read(file("any.yaml", "required: [[p, q]]\n"), null).isRequired("p", "q"));
    }

    @Test
    void unknownNamesAreRefusedWithLineAndField() throws IOException {
        assertTrue(refused("k.yaml", "required:\n  - [smoking, tar]\n  - [tar, lung]\n")
                .endsWith("k.yaml, line 3, required[2]: variable 'lung' is not in the data"));
        assertTrue(refused("k.yaml", "tiers:\n  - [age]\n  - [weight]\n")
                .endsWith("k.yaml, line 3, tiers[2]: variable 'weight' is not in the data"));
        assertTrue(refused("k.json", "{\n\"forbidden\": [[\"tar\", \"Tar\"]]\n}")
                .endsWith("k.json, line 2, forbidden[1]: variable 'Tar' is not in the data"));
    }

    @Test
    void shapeErrorsNameLineAndField() throws IOException {
        assertTrue(refused("k.yaml", "required: [[age, tar]]\nrequire: [[tar, cancer]]\n")
                .endsWith("k.yaml, line 2, field 'require': unknown field (allowed: required, forbidden, tiers)"));
        assertTrue(refused("k.yaml", "required:\n  - [age, tar, cancer]\n")
                .endsWith("k.yaml, line 2, required[1]: expected a pair [from, to], got 3 names"));
        assertTrue(refused("k.yaml", "required:\n  - age\n")
                .endsWith("k.yaml, line 2, required[1]: expected a list of names, got a single value"));
        assertTrue(refused("k.yaml", "forbidden: age\n")
                .endsWith("k.yaml, line 1, forbidden: expected a list of pairs [from, to]"));
        assertTrue(refused("k.yaml", "tiers:\n  - [age, [sex]]\n")
                .endsWith("k.yaml, line 2, tiers[1]: expected a variable name, got a list"));
        assertTrue(refused("k.yaml", "required:\n  - [age, age]\n")
                .endsWith("k.yaml, line 2, required[1]: an edge from 'age' to itself"));
        assertTrue(refused("k.yaml", "- [age, tar]\n").endsWith("k.yaml, line 1: expected fields required, forbidden and tiers"));
        String dup = refused("k.yaml", "required: [[age, tar]]\nrequired: [[tar, cancer]]\n");
        assertTrue(dup.contains("k.yaml, line 2, column 9: not valid YAML: Duplicate field 'required'"), dup);
        String syntax = refused("k.yaml", "required: [[age, tar]\ntiers: [[age]]\n");
        assertTrue(syntax.contains("k.yaml, line ") && syntax.contains("not valid YAML"), syntax);
    }

    @Test
    void contradictionsAreRefusedNamingTheEdges() throws IOException {
        assertTrue(refused("k.yaml", "required: [[age, tar]]\nforbidden: [[age, tar]]\n")
                .endsWith("k.yaml: edge age -> tar is both required and forbidden"));
        assertTrue(refused("k.yaml", "required: [[cancer, age]]\ntiers: [[age], [cancer]]\n")
                .endsWith("k.yaml: required edge cancer -> age points from tier 2 back to tier 1"));
        assertTrue(refused("k.yaml", "tiers: [[age, sex], [sex]]\n").endsWith("k.yaml: variable 'sex' is in tier 1 and tier 2"));
        assertTrue(refused("k.yaml", "required: [[age, tar], [tar, age]]\n").contains("required edges form a cycle"));
    }
}
