package dev.touchstone.learners.constraint;

import dev.touchstone.core.graph.Mark;
import dev.touchstone.core.graph.MutableGraph;
import dev.touchstone.learners.knowledge.KnowledgeIndex;

/**
 * Background knowledge as marks of a partial ancestral graph, set before the orientation
 * rules run (core's {@code PagRules} only ever replace circles, so these marks are kept).
 *
 * <p>Knowledge is read about the graph FCI returns, whose marks speak of ancestry among the
 * observed variables (Zhang 2008, §2): a tail at a means a is an ancestor of b, an
 * arrowhead at a means it is not.
 * <ul>
 *   <li>a required edge a → b: tail at a, arrowhead at b (a causes b, so b is not an
 *   ancestor of a in an acyclic model);</li>
 *   <li>a forbidden direction a → b, explicit or from tiers (a in a later tier than b): an
 *   arrowhead at a, i.e. a is not an ancestor of b. This is exactly what temporal tiers
 *   mean; for an explicit forbidden direction it is the ancestral reading. The mark at b is
 *   left to the rules: a tail at b (b → a) and an arrowhead (a ↔ b, a hidden common cause)
 *   both stay possible. Giving the earlier end a tail instead would claim an ancestry the
 *   tiers do not imply, which is wrong under hidden confounding.</li>
 * </ul>
 * A mark that contradicts one already set is left as it is: required edges are set first
 * and win. Cost: O(p²) look-ups over the adjacent pairs.
 */
final class PagKnowledge {

    private PagKnowledge() {
    }

    /** Sets the marks the knowledge implies on the edges of {@code g}; returns how many changed. */
    static int apply(MutableGraph g, KnowledgeIndex knowledge) {
        if (knowledge.isEmpty()) {
            return 0;
        }
        int changed = 0;
        for (int[] r : knowledge.requiredEdges()) {
            if (g.adjacent(r[0], r[1])) {
                changed += set(g, r[0], r[1], Mark.TAIL) + set(g, r[1], r[0], Mark.ARROW);
            }
        }
        for (int a = 0; a < g.size(); a++) {
            for (int b : g.neighbours(a)) {
                if (knowledge.isForbidden(a, b)) {
                    changed += set(g, a, b, Mark.ARROW);
                }
            }
        }
        return changed;
    }

    private static int set(MutableGraph g, int at, int other, Mark mark) {
        if (g.markAt(at, other) != Mark.CIRCLE) {
            return 0;
        }
        g.setMark(at, other, mark);
        return 1;
    }
}
