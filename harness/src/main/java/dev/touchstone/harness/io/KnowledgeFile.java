package dev.touchstone.harness.io;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;

import dev.touchstone.core.knowledge.Knowledge;

import java.io.IOException;
import java.io.Reader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;

/**
 * Background knowledge from a YAML or JSON file of this plain shape (every field optional):
 * <pre>
 * required: [[smoking, tar]]          # directed edges that must be present: from, to
 * forbidden: [[tar, smoking]]         # directed edges that must be absent
 * tiers: [[age, sex], [smoking], [tar, cancer]]   # earlier tiers cannot be caused by later ones
 * </pre>
 * A file ending in {@code .json} is read as JSON, anything else as YAML. The file is read
 * token by token so that every problem is reported with the file, the line and the field
 * (e.g. {@code required[2]}): an unknown field, a field given twice, an entry that is not a
 * pair or a list of names, a name the data do not have, and every contradiction refused
 * by {@link Knowledge.Builder#build()}. Cost O(size of the file).
 */
public final class KnowledgeFile {

    private static final JsonFactory JSON = JsonFactory.builder().enable(
            com.fasterxml.jackson.core.StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();
    private static final YAMLFactory YAML = YAMLFactory.builder().enable(
            com.fasterxml.jackson.core.StreamReadFeature.STRICT_DUPLICATE_DETECTION).build();

    private KnowledgeFile() {
    }

    /** The JSON text of {@code k} (the fields above; empty lists when there is nothing), read back by {@link #read}. */
    public static String toJson(Knowledge k) {
        com.fasterxml.jackson.databind.ObjectMapper m = new com.fasterxml.jackson.databind.ObjectMapper();
        com.fasterxml.jackson.databind.node.ObjectNode root = m.createObjectNode();
        com.fasterxml.jackson.databind.node.ArrayNode req = root.putArray("required");
        k.required().stream().sorted(java.util.Comparator.comparing(Knowledge.DirectedPair::toString))
                .forEach(p -> req.addArray().add(p.from()).add(p.to()));
        com.fasterxml.jackson.databind.node.ArrayNode forb = root.putArray("forbidden");
        k.forbidden().stream().sorted(java.util.Comparator.comparing(Knowledge.DirectedPair::toString))
                .forEach(p -> forb.addArray().add(p.from()).add(p.to()));
        com.fasterxml.jackson.databind.node.ArrayNode tiers = root.putArray("tiers");
        for (List<String> tier : k.tiers()) {
            com.fasterxml.jackson.databind.node.ArrayNode t = tiers.addArray();
            tier.forEach(t::add);
        }
        try {
            return m.writerWithDefaultPrettyPrinter().writeValueAsString(root) + "\n";
        } catch (com.fasterxml.jackson.core.JsonProcessingException e) {
            throw new IllegalStateException(e);
        }
    }

    /**
     * Reads knowledge and checks every name against {@code dataNames} (null to skip that check).
     *
     * @throws FileFormatException naming the file, line and field at fault
     */
    public static Knowledge read(Path file, List<String> dataNames) throws IOException {
        boolean json = file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".json");
        Set<String> known = dataNames == null ? null : new HashSet<>(dataNames);
        try (Reader in = InputFiles.reader(file);
             JsonParser parser = (json ? JSON : YAML).createParser(in)) {
            return new Reading(file, parser, known).knowledge();
        } catch (JsonProcessingException e) {
            String where = e.getLocation() == null ? null : "line " + e.getLocation().getLineNr() + ", column "
                    + e.getLocation().getColumnNr();
            throw new FileFormatException(file, where, "not valid " + (json ? "JSON" : "YAML") + ": "
                    + JsonTrees.parserWords(e));
        }
    }

    private static final class Reading {
        private final Path file;
        private final JsonParser parser;
        private final Set<String> known;
        private final Knowledge.Builder builder = Knowledge.builder();

        Reading(Path file, JsonParser parser, Set<String> known) {
            this.file = file;
            this.parser = parser;
            this.known = known;
        }

        private String line() {
            return "line " + parser.currentTokenLocation().getLineNr();
        }

        private FileFormatException error(String field, String detail) {
            return new FileFormatException(file, line() + ", " + field, detail);
        }

        Knowledge knowledge() throws IOException {
            JsonToken t = parser.nextToken();
            if (t == null) {
                throw new FileFormatException(file, null, "the file is empty (give at least one of required,"
                        + " forbidden and tiers, or leave the knowledge file out)");
            }
            if (t != JsonToken.START_OBJECT) {
                throw new FileFormatException(file, line(), "expected fields required, forbidden and tiers");
            }
            while ((t = parser.nextToken()) == JsonToken.FIELD_NAME) {
                String field = parser.currentName();
                parser.nextToken();
                switch (field) {
                    case "required":
                        pairs(field, true);
                        break;
                    case "forbidden":
                        pairs(field, false);
                        break;
                    case "tiers":
                        tiers();
                        break;
                    default:
                        throw new FileFormatException(file, line() + ", field '" + field + "'",
                                "unknown field (allowed: required, forbidden, tiers)");
                }
            }
            if (parser.nextToken() != null) {
                throw new FileFormatException(file, line(), "unexpected content after the end of the knowledge"
                        + " (remove it)");
            }
            try {
                return builder.build();
            } catch (IllegalArgumentException e) {
                throw new FileFormatException(file, null, e.getMessage());
            }
        }

        /** An empty value ({@code required:} with nothing after it) means no entries. */
        private boolean isEmptyValue() throws IOException {
            JsonToken t = parser.currentToken();
            return t == JsonToken.VALUE_NULL || (t == JsonToken.VALUE_STRING && parser.getText().isEmpty());
        }

        private void pairs(String field, boolean required) throws IOException {
            if (isEmptyValue()) {
                return;
            }
            if (parser.currentToken() != JsonToken.START_ARRAY) {
                throw error(field, "expected a list of pairs [from, to]");
            }
            int k = 0;
            while (parser.nextToken() != JsonToken.END_ARRAY) {
                k++;
                String place = field + "[" + k + "]";
                String lineOfPair = line();
                List<String> names = names(place);
                if (names.size() != 2) {
                    throw new FileFormatException(file, lineOfPair + ", " + place,
                            "expected a pair [from, to], got " + names.size() + (names.size() == 1 ? " name" : " names"));
                }
                if (names.get(0).equals(names.get(1))) {
                    throw new FileFormatException(file, lineOfPair + ", " + place,
                            "an edge from '" + names.get(0) + "' to itself");
                }
                if (required) {
                    builder.require(names.get(0), names.get(1));
                } else {
                    builder.forbid(names.get(0), names.get(1));
                }
            }
        }

        private void tiers() throws IOException {
            if (isEmptyValue()) {
                return;
            }
            if (parser.currentToken() != JsonToken.START_ARRAY) {
                throw error("tiers", "expected a list of tiers, each a list of names");
            }
            int k = 0;
            while (parser.nextToken() != JsonToken.END_ARRAY) {
                k++;
                List<String> names = names("tiers[" + k + "]");
                builder.tier(names);
            }
        }

        /** A list of names at the current token, each checked against the data. */
        private List<String> names(String place) throws IOException {
            if (parser.currentToken() != JsonToken.START_ARRAY) {
                throw error(place, "expected a list of names, got " + describe(parser.currentToken()));
            }
            List<String> out = new ArrayList<>();
            JsonToken t;
            while ((t = parser.nextToken()) != JsonToken.END_ARRAY) {
                if (!t.isScalarValue() || t == JsonToken.VALUE_NULL) {
                    throw error(place, "expected a variable name, got " + describe(t));
                }
                String name = parser.getText();
                if (known != null && !known.contains(name)) {
                    throw error(place, "variable '" + name + "' is not in the data");
                }
                out.add(name);
            }
            return out;
        }

        private static String describe(JsonToken t) {
            if (t == null) {
                return "the end of the file";
            }
            switch (t) {
                case START_ARRAY:
                    return "a list";
                case START_OBJECT:
                    return "a mapping";
                case VALUE_NULL:
                    return "an empty value";
                default:
                    return "a single value";
            }
        }
    }
}
