package dev.touchstone.harness.study;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One value of a parsed YAML or JSON document with the place it came from (file, line,
 * column) and its path from the root (e.g. {@code truth.graph.nodes}), so that every
 * validation error can say exactly where the offending value is. Immutable.
 *
 * <p>A map keeps its keys in file order and remembers where each key was written.
 */
public final class Node {

    /** The shape of a value. */
    public enum Kind { MAP, LIST, SCALAR }

    private final Kind kind;
    private final Object scalar;
    private final Map<String, Node> map;
    private final Map<String, Place> keyPlaces;
    private final List<Node> list;
    private final Place place;
    private final String path;

    private Node(Kind kind, Object scalar, Map<String, Node> map, Map<String, Place> keyPlaces, List<Node> list,
                 Place place, String path) {
        this.kind = kind;
        this.scalar = scalar;
        this.map = map;
        this.keyPlaces = keyPlaces;
        this.list = list;
        this.place = place;
        this.path = path;
    }

    /** A scalar: String, Long, Double, Boolean or null. */
    static Node scalar(Object value, Place place, String path) {
        return new Node(Kind.SCALAR, value, Map.of(), Map.of(), List.of(), place, path);
    }

    static Node map(Map<String, Node> entries, Map<String, Place> keyPlaces, Place place, String path) {
        return new Node(Kind.MAP, null, Collections.unmodifiableMap(new LinkedHashMap<>(entries)),
                Collections.unmodifiableMap(new LinkedHashMap<>(keyPlaces)), List.of(), place, path);
    }

    static Node list(List<Node> items, Place place, String path) {
        return new Node(Kind.LIST, null, Map.of(), Map.of(), List.copyOf(items), place, path);
    }

    public Kind kind() {
        return kind;
    }

    public boolean isMap() {
        return kind == Kind.MAP;
    }

    public boolean isList() {
        return kind == Kind.LIST;
    }

    public boolean isScalar() {
        return kind == Kind.SCALAR;
    }

    public boolean isNull() {
        return kind == Kind.SCALAR && scalar == null;
    }

    /** The scalar value (String, Long, Double, Boolean or null); null for maps and lists. */
    public Object value() {
        return scalar;
    }

    /** The entries of a map in file order (empty for other kinds). */
    public Map<String, Node> entries() {
        return map;
    }

    /** The entry {@code key} of a map, or null. */
    public Node get(String key) {
        return map.get(key);
    }

    /** Where {@code key} was written in this map (the map's own place if unknown). */
    public Place keyPlace(String key) {
        Place p = keyPlaces.get(key);
        return p == null ? place : p;
    }

    /** The items of a list (empty for other kinds). */
    public List<Node> items() {
        return list;
    }

    /** Where the value starts. */
    public Place place() {
        return place;
    }

    /** The path from the document root, e.g. {@code learners[1].with.alpha}; empty for the root. */
    public String path() {
        return path;
    }

    /** A short description of the value for messages: the scalar as written, or "a map" / "a list". */
    public String describe() {
        switch (kind) {
            case MAP:
                return "a map";
            case LIST:
                return "a list";
            default:
                return scalar == null ? "nothing" : "'" + scalar + "'";
        }
    }

    /** Converts back to plain Java values (LinkedHashMap, List, scalars) for writing out again. */
    public Object toPlain() {
        switch (kind) {
            case MAP: {
                Map<String, Object> out = new LinkedHashMap<>();
                map.forEach((k, v) -> out.put(k, v.toPlain()));
                return out;
            }
            case LIST: {
                List<Object> out = new java.util.ArrayList<>();
                list.forEach(v -> out.add(v.toPlain()));
                return out;
            }
            default:
                return scalar;
        }
    }

    /** A place in a file: file name, 1-based line and column (0 when unknown). */
    public record Place(String file, int line, int column) {
        @Override
        public String toString() {
            return line > 0 ? file + ":" + line + ":" + column : file;
        }
    }
}
