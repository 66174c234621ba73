package dev.touchstone.harness.study;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads a YAML or JSON document into a tree of {@link Node}s that remember their line,
 * column and path.
 *
 * <p>Built on Jackson's streaming parser rather than data binding, because binding to
 * records reports unknown properties at the end of the object and silently fills missing
 * fields with 0 or null (Jackson's documented behaviour for records); with a located tree every check can name the
 * exact key. Duplicate keys and a second document are refused. Cost: linear in the file.
 */
public final class NodeReader {

    private static final JsonFactory JSON = new JsonFactory();
    private static final YAMLFactory YAML = new YAMLFactory();

    private NodeReader() {
    }

    /** Reads a file; {@code .json} files are read as JSON, everything else as YAML. */
    public static Node read(Path file) {
        String text = dev.touchstone.harness.io.InputFiles.readString(file);
        boolean json = file.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".json");
        return read(file.getFileName().toString(), text, json);
    }

    /** Reads text; {@code name} is used in messages. */
    public static Node read(String name, String text, boolean json) {
        try (Reader r = new StringReader(text); JsonParser p = (json ? JSON : YAML).createParser(r)) {
            JsonToken first = p.nextToken();
            if (first == null) {
                throw new StudyException(new Node.Place(name, 1, 1), "", "the file is empty");
            }
            Node root = readValue(p, name, "");
            if (!root.isMap()) {
                throw new StudyException(root.place(), "", "the file must hold a map of fields (name: value), found "
                        + root.describe());
            }
            JsonToken after = p.nextToken();
            if (after != null) {
                throw new StudyException(place(p, name), "", "unexpected content after the end of the document"
                        + " (a second YAML document?)");
            }
            return root;
        } catch (JsonProcessingException e) {
            JsonLocation loc = e.getLocation();
            // the parser's context lines, echoed source and caret are cut; its problem lines are kept
            String msg = dev.touchstone.harness.BadInputException.oneLine(e.getOriginalMessage());
            throw new StudyException(loc == null ? new Node.Place(name, 0, 0)
                    : new Node.Place(name, loc.getLineNr(), loc.getColumnNr()), "", "not valid "
                    + (json ? "JSON" : "YAML") + ": " + msg.trim());
        } catch (IOException e) {
            throw new StudyException(new Node.Place(name, 0, 0), "", "cannot be read: " + e.getMessage());
        }
    }

    private static Node.Place place(JsonParser p, String name) {
        JsonLocation loc = p.currentTokenLocation();
        return new Node.Place(name, Math.max(loc.getLineNr(), 0), Math.max(loc.getColumnNr(), 0));
    }

    private static Node readValue(JsonParser p, String name, String path) throws IOException {
        Node.Place here = place(p, name);
        JsonToken t = p.currentToken();
        switch (t) {
            case START_OBJECT: {
                Map<String, Node> entries = new LinkedHashMap<>();
                Map<String, Node.Place> keys = new LinkedHashMap<>();
                while (p.nextToken() == JsonToken.FIELD_NAME) {
                    String key = p.currentName();
                    Node.Place keyPlace = place(p, name);
                    String childPath = path.isEmpty() ? key : path + "." + key;
                    if (entries.containsKey(key)) {
                        throw new StudyException(keyPlace, childPath, "this field is given twice (first at line "
                                + keys.get(key).line() + ")");
                    }
                    p.nextToken();
                    entries.put(key, readValue(p, name, childPath));
                    keys.put(key, keyPlace);
                }
                return Node.map(entries, keys, here, path);
            }
            case START_ARRAY: {
                List<Node> items = new ArrayList<>();
                int i = 0;
                while (p.nextToken() != JsonToken.END_ARRAY) {
                    items.add(readValue(p, name, path + "[" + i + "]"));
                    i++;
                }
                return Node.list(items, here, path);
            }
            case VALUE_STRING:
                return Node.scalar(p.getText(), here, path);
            case VALUE_NUMBER_INT:
                if (p.getNumberType() == JsonParser.NumberType.BIG_INTEGER) {
                    throw new StudyException(here, path, "the number " + p.getText() + " is too large");
                }
                return Node.scalar(p.getLongValue(), here, path);
            case VALUE_NUMBER_FLOAT:
                return Node.scalar(p.getDoubleValue(), here, path);
            case VALUE_TRUE:
                return Node.scalar(Boolean.TRUE, here, path);
            case VALUE_FALSE:
                return Node.scalar(Boolean.FALSE, here, path);
            case VALUE_NULL:
                return Node.scalar(null, here, path);
            default:
                throw new StudyException(here, path, "unexpected " + t);
        }
    }
}
