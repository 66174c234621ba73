package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.Plan;

import java.util.ArrayList;
import java.util.List;
import java.util.ServiceLoader;

/**
 * A named engine found by Java's {@link ServiceLoader} (file
 * {@code META-INF/services/dev.touchstone.harness.execution.EngineProvider}), chosen with
 * {@code touchstone run STUDY --engine NAME}. The local engine is built in.
 */
public interface EngineProvider {

    /** The name given to {@code --engine}: lower case, e.g. {@code spark}. */
    String name();

    /**
     * The engine for one session.
     *
     * @param master where the engine's cluster is (its own URL form), or null for the engine's default
     * @param plan   the plan of the study being run
     * @param recipe what a remote worker needs to rebuild that plan
     * @throws IllegalArgumentException with one line saying what is wrong (bad master, a study the engine cannot run)
     */
    Engine create(String master, Plan plan, RunRecipe recipe);

    /** The local engine's name. */
    String LOCAL_NAME = "local";

    /** The names of the engines available: {@code local} first, then the providers on the class path. */
    static List<String> available(ClassLoader loader) {
        List<String> names = new ArrayList<>();
        names.add(LOCAL_NAME);
        for (EngineProvider p : ServiceLoader.load(EngineProvider.class, loader)) {
            names.add(p.name());
        }
        return names;
    }

    /** The provider of this name on the class path, or null ({@code local} is not a provider). */
    static EngineProvider find(String name, ClassLoader loader) {
        for (EngineProvider p : ServiceLoader.load(EngineProvider.class, loader)) {
            if (p.name().equals(name)) {
                return p;
            }
        }
        return null;
    }
}
