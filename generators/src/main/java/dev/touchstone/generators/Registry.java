package dev.touchstone.generators;

import java.util.ArrayList;
import java.util.List;
import java.util.function.Function;

/** Look-up by id in the fixed lists of built-in generators, with one wording for an unknown id. */
public final class Registry {

    private Registry() {
    }

    /**
     * The entry of {@code all} whose id is {@code wanted}.
     *
     * @param what what the entries are, for the message (such as "graph family")
     * @throws IllegalArgumentException naming the id and listing the known ones
     */
    public static <T> T byId(List<T> all, Function<T, String> id, String what, String wanted) {
        List<String> known = new ArrayList<>();
        for (T entry : all) {
            if (id.apply(entry).equals(wanted)) {
                return entry;
            }
            known.add(id.apply(entry));
        }
        throw new IllegalArgumentException("unknown " + what + " '" + wanted + "' (known: " + String.join(", ", known)
                + ")");
    }
}
