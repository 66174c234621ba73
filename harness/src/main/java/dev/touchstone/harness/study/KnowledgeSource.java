package dev.touchstone.harness.study;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * What background knowledge a learner entry's runs receive: none (the default), or the tiers
 * the truth comes with (the layers of a layered graph, observed variables only; empty for
 * truths without tiers, so such runs get no knowledge).
 */
public enum KnowledgeSource {
    NONE,
    TIERS;

    /** The word used in study files. */
    public String word() {
        return name().toLowerCase(Locale.ROOT);
    }

    /** The allowed words, for messages. */
    public static List<String> words() {
        return Arrays.stream(values()).map(KnowledgeSource::word).toList();
    }

    /** The source named by a word, or null. */
    public static KnowledgeSource of(String word) {
        for (KnowledgeSource k : values()) {
            if (k.word().equals(word)) {
                return k;
            }
        }
        return null;
    }
}
