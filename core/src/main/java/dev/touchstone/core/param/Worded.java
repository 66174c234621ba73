package dev.touchstone.core.param;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * An enum whose constants are written in files, on the command line and in listings as
 * words derived from their declared names: lower case, with {@code -} for {@code _}
 * ({@code ORDER_INDEPENDENT} is {@code order-independent}). Implementing it gives an enum
 * its word, the list of its words and a parser with one wording of the "unknown" message,
 * instead of a hand-written pair per enum (common practice for enum spellings).
 *
 * <p>Parsing ignores case and surrounding blanks, as {@link ParameterSpec} does for choices.
 */
public interface Worded {

    /** The constant's declared name (every enum has it). */
    String name();

    /** The word for this constant: its name in lower case with {@code -} for {@code _}. */
    default String word() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }

    /** The words of every constant of {@code type}, in declaration order. */
    static <E extends Enum<E> & Worded> List<String> words(Class<E> type) {
        List<String> out = new ArrayList<>();
        for (E e : type.getEnumConstants()) {
            out.add(e.word());
        }
        return List.copyOf(out);
    }

    /** The constant of {@code type} written {@code word} (case and surrounding blanks ignored), if any. */
    static <E extends Enum<E> & Worded> Optional<E> find(Class<E> type, String word) {
        if (word != null) {
            String w = word.trim();
            for (E e : type.getEnumConstants()) {
                if (e.word().equalsIgnoreCase(w)) {
                    return Optional.of(e);
                }
            }
        }
        return Optional.empty();
    }

    /**
     * The constant of {@code type} written {@code word}.
     *
     * @param what what the word names, for the message (e.g. {@code "collider rule"})
     * @throws IllegalArgumentException {@code unknown WHAT 'WORD' (allowed: a, b, c)}
     */
    static <E extends Enum<E> & Worded> E parse(Class<E> type, String word, String what) {
        return find(type, word).orElseThrow(() -> new IllegalArgumentException("unknown " + what + " '" + word
                + "' (allowed: " + String.join(", ", words(type)) + ")"));
    }
}
