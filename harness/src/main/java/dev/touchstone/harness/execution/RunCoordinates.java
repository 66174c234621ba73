package dev.touchstone.harness.execution;

import dev.touchstone.harness.study.RunDefinition;
import dev.touchstone.metrics.results.Setting;

/**
 * The setting a run's result is written with: its coordinates by name. A study's come from
 * its {@link SettingLayout}; a calibration names its truths and sizes itself.
 */
@FunctionalInterface
public interface RunCoordinates {

    /** The setting of a run. */
    Setting setting(RunDefinition run);
}
