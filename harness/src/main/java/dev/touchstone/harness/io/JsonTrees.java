package dev.touchstone.harness.io;

import com.fasterxml.jackson.core.JsonParseException;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import java.io.IOException;
import java.nio.file.Path;
import java.util.regex.Pattern;

/**
 * Reads a JSON file of ours (graph, model) into a tree the one strict way: UTF-8 decoded
 * strictly ({@link InputFiles}), nothing allowed after the closing brace, and every parse
 * error as one line with the file, line and column and the parser's words without its
 * echo of where the source came from.
 */
final class JsonTrees {

    /** Jackson's note of where a bracket opened, which repeats the place and names a stream setting. */
    private static final Pattern SOURCE_NOTE = Pattern.compile("\\s*\\(start marker at \\[Source:[^\\]]*\\]\\)");

    private JsonTrees() {
    }

    /**
     * The file's JSON value, or null for an empty file.
     *
     * @throws FileFormatException naming the file and the place at fault
     */
    static JsonNode read(Path file, ObjectMapper mapper) throws IOException {
        try (JsonParser parser = mapper.createParser(InputFiles.reader(file))) {
            JsonNode root = mapper.readTree(parser);
            if (root != null && parser.nextToken() != null) {
                throw new FileFormatException(file, "line " + parser.currentTokenLocation().getLineNr() + ", column "
                        + parser.currentTokenLocation().getColumnNr(),
                        "unexpected content after the end of the JSON object (remove it)");
            }
            return root;
        } catch (JsonParseException e) {
            throw new FileFormatException(file, "line " + e.getLocation().getLineNr() + ", column "
                    + e.getLocation().getColumnNr(), "not valid JSON: " + parserWords(e));
        } catch (JsonProcessingException e) {
            throw new FileFormatException(file, null, "not valid JSON: " + parserWords(e));
        }
    }

    /** The parser's message without its note of the source. */
    static String parserWords(JsonProcessingException e) {
        return SOURCE_NOTE.matcher(e.getOriginalMessage()).replaceAll("");
    }
}
