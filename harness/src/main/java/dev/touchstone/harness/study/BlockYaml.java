package dev.touchstone.harness.study;

import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Writes a tree of maps, lists and scalars as block-style YAML, for the normalised study text
 * ({@link StudyWriter}): a map's entries as {@code key: value} lines, a list's items as
 * {@code - item} lines at the indentation of their key, nested maps two spaces further in.
 *
 * <p>Scalars are written so that a YAML reader gives back the same value and type: integers
 * plainly, reals by {@link Double#toString} (always with a point or an exponent, so they read
 * back as reals), booleans as {@code true}/{@code false}, and a word plainly only when it
 * starts with a letter or {@code _}, holds only letters, digits and {@code _ . + / -}, and is
 * none of YAML 1.1's boolean or null words ({@code yes}, {@code off}, {@code null}, …); every
 * other string is double-quoted with backslash escapes for quotes, backslashes and control
 * characters (YAML 1.2 §7.3.1). Quoting more often than needed costs nothing but looks; quoting
 * too rarely would change a value, so the plain set is kept small.
 */
final class BlockYaml {

    private static final Pattern PLAIN = Pattern.compile("[A-Za-z_][A-Za-z0-9_.+/\\-]*");

    /** Words YAML 1.1 reads as booleans or null when plain (compared ignoring case). */
    private static final Set<String> RESERVED = Set.of("y", "n", "yes", "no", "true", "false", "on", "off", "null");

    private BlockYaml() {
    }

    /** The map as a YAML document (no start marker), each line ending with a newline. */
    static String text(Map<?, ?> root) {
        StringBuilder sb = new StringBuilder();
        if (root.isEmpty()) {
            return "{}\n";
        }
        map(root, 0, sb);
        return sb.toString();
    }

    private static void map(Map<?, ?> m, int indent, StringBuilder sb) {
        for (Map.Entry<?, ?> e : m.entrySet()) {
            pad(sb, indent).append(scalar(e.getKey())).append(':');
            Object v = e.getValue();
            if (v instanceof Map<?, ?> child && !child.isEmpty()) {
                sb.append('\n');
                map(child, indent + 2, sb);
            } else if (v instanceof List<?> items && !items.isEmpty()) {
                sb.append('\n');
                list(items, indent, sb);
            } else {
                sb.append(' ').append(scalar(v)).append('\n');
            }
        }
    }

    private static void list(List<?> items, int indent, StringBuilder sb) {
        for (Object item : items) {
            if (item instanceof Map<?, ?> child && !child.isEmpty()) {
                nested(sb, indent, b -> map(child, indent + 2, b));
            } else if (item instanceof List<?> inner && !inner.isEmpty()) {
                nested(sb, indent, b -> list(inner, indent + 2, b));
            } else {
                pad(sb, indent).append("- ").append(scalar(item)).append('\n');
            }
        }
    }

    /** A list item holding a map or list: its first line starts after the item's {@code "- "}. */
    private static void nested(StringBuilder sb, int indent, java.util.function.Consumer<StringBuilder> body) {
        StringBuilder inner = new StringBuilder();
        body.accept(inner);
        pad(sb, indent).append("- ").append(inner, indent + 2, inner.length());
    }

    private static StringBuilder pad(StringBuilder sb, int indent) {
        for (int i = 0; i < indent; i++) {
            sb.append(' ');
        }
        return sb;
    }

    /** A scalar (or an empty map or list) as YAML. */
    static String scalar(Object v) {
        if (v == null) {
            return "null";
        }
        if (v instanceof Map<?, ?>) {
            return "{}";
        }
        if (v instanceof List<?>) {
            return "[]";
        }
        if (v instanceof Double d) {
            return Double.toString(d);
        }
        if (v instanceof Float f) {
            return Float.toString(f);
        }
        if (v instanceof Integer || v instanceof Long || v instanceof Short || v instanceof Byte
                || v instanceof java.math.BigInteger || v instanceof Boolean) {
            return v.toString();
        }
        String s = v instanceof Enum<?> e ? e.name() : v.toString();
        return plain(s) ? s : quoted(s);
    }

    private static boolean plain(String s) {
        return PLAIN.matcher(s).matches() && !RESERVED.contains(s.toLowerCase(java.util.Locale.ROOT));
    }

    /**
     * Whether the char at {@code i} may stand as it is inside double quotes: YAML's printable set
     * (1.2 §5.1) less the line and paragraph separators and the byte-order mark, which readers
     * treat specially; a surrogate only as half of a pair.
     */
    private static boolean printable(String s, int i) {
        char c = s.charAt(i);
        if (Character.isHighSurrogate(c)) {
            return i + 1 < s.length() && Character.isLowSurrogate(s.charAt(i + 1));
        }
        if (Character.isLowSurrogate(c)) {
            return i > 0 && Character.isHighSurrogate(s.charAt(i - 1));
        }
        return c >= 0x20 && c < 0x7F || c >= 0xA0 && c != 0x2028 && c != 0x2029 && c != 0xFEFF && c < 0xFFFE;
    }

    private static String quoted(String s) {
        StringBuilder sb = new StringBuilder(s.length() + 2).append('"');
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '"' -> sb.append("\\\"");
                case '\\' -> sb.append("\\\\");
                case '\n' -> sb.append("\\n");
                case '\t' -> sb.append("\\t");
                case '\r' -> sb.append("\\r");
                default -> {
                    if (printable(s, i)) {
                        sb.append(c);
                    } else {
                        sb.append(String.format(java.util.Locale.ROOT, "\\u%04x", (int) c));
                    }
                }
            }
        }
        return sb.append('"').toString();
    }
}
