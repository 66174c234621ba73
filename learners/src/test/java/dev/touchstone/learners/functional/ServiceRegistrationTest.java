package dev.touchstone.learners.functional;

import dev.touchstone.core.learner.Learner;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

import java.util.HashSet;
import java.util.ServiceLoader;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertTrue;

class ServiceRegistrationTest {

    @Test
    @DisplayName("DirectLiNGAM, CAM and NOTEARS are found by Java's service loader (so they are listed and usable by id)")
    void learnersAreRegistered() {
        Set<String> ids = new HashSet<>();
        for (Learner l : ServiceLoader.load(Learner.class)) {
            ids.add(l.description().id());
        }
        assertTrue(ids.contains("direct-lingam"), ids.toString());
        assertTrue(ids.contains("notears-linear"), ids.toString());
        assertTrue(ids.contains("cam"), ids.toString());
    }
}
