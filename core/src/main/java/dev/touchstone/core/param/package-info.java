/** Declared parameters (name, type, default, range, meaning) shared by learners, generators and the command line. */
package dev.touchstone.core.param;
