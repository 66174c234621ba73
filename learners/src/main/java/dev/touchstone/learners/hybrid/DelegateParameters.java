package dev.touchstone.learners.hybrid;

import dev.touchstone.core.learner.LearnerDescription;
import dev.touchstone.core.param.ParameterSpec;
import dev.touchstone.core.param.ParameterValues;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * How a hybrid learner declares and hands on the parameters of the learners it runs: its own
 * declaration is the union of theirs (a name declared twice must mean the same thing, so it is
 * declared once), and each part is given the values of the names it declares.
 */
final class DelegateParameters {

    private DelegateParameters() {
    }

    /** The specs of every list in order, each name once (the first declaration kept). */
    @SafeVarargs
    static List<ParameterSpec> union(List<ParameterSpec>... lists) {
        Map<String, ParameterSpec> byName = new LinkedHashMap<>();
        for (List<ParameterSpec> list : lists) {
            for (ParameterSpec s : list) {
                byName.putIfAbsent(s.name(), s);
            }
        }
        return new ArrayList<>(byName.values());
    }

    /** The values among {@code all} that {@code specs} declare, resolved against them. */
    static ParameterValues part(String owner, ParameterValues all, List<ParameterSpec> specs) {
        Map<String, Object> raw = new LinkedHashMap<>();
        for (ParameterSpec s : specs) {
            Object v = all.asMap().get(s.name());
            if (v != null) {
                raw.put(s.name(), v);
            }
        }
        return ParameterValues.resolve(owner, specs, raw);
    }

    /** The values for the learner {@code delegate} describes. */
    static ParameterValues part(String owner, ParameterValues all, LearnerDescription delegate) {
        return part(owner + " (its " + delegate.id() + " part)", all, delegate.parameters());
    }
}
