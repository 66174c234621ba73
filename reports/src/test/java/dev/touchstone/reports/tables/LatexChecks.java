package dev.touchstone.reports.tables;

import java.util.ArrayDeque;
import java.util.Deque;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Compile-free checks of generated LaTeX (common practice where no TeX installation is at
 * hand): braces balance outside escapes, every {@code \begin} meets its own {@code \end} in
 * order, and every row has the tabular's number of columns.
 */
public final class LatexChecks {

    private static final Pattern ENVIRONMENT = Pattern.compile("\\\\(begin|end)\\{([a-z*]+)}");

    private LatexChecks() {
    }

    /** Ampersands that separate columns (not escaped as \&). */
    static int separators(String line) {
        int n = 0;
        for (int i = 0; i < line.length(); i++) {
            if (line.charAt(i) == '&' && (i == 0 || line.charAt(i - 1) != '\\')) {
                n++;
            }
        }
        return n;
    }

    /** Asserts the checks above on a rendered table of {@code columns} columns; returns its number of rows. */
    public static int assertBalanced(String tex, int columns) {
        int depth = 0;
        for (int i = 0; i < tex.length(); i++) {
            char c = tex.charAt(i);
            boolean escaped = i > 0 && tex.charAt(i - 1) == '\\' && (i < 2 || tex.charAt(i - 2) != '\\');
            if (!escaped && c == '{') {
                depth++;
            } else if (!escaped && c == '}') {
                depth--;
            }
            assertTrue(depth >= 0, "a closing brace without an opening one at " + i + ":\n" + tex);
        }
        assertEquals(0, depth, tex);
        Deque<String> open = new ArrayDeque<>();
        Matcher m = ENVIRONMENT.matcher(tex);
        while (m.find()) {
            if (m.group(1).equals("begin")) {
                open.push(m.group(2));
            } else {
                assertTrue(!open.isEmpty() && open.pop().equals(m.group(2)), "\\end{" + m.group(2)
                        + "} closes no matching \\begin:\n" + tex);
            }
        }
        assertTrue(open.isEmpty(), "environments left open: " + open + "\n" + tex);
        int rows = 0;
        for (String line : tex.split("\n")) {
            if (line.endsWith("\\\\")) {
                rows++;
                assertEquals(columns - 1, separators(line), columns + " columns: " + line);
            }
        }
        return rows;
    }
}
