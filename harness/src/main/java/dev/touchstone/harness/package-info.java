/** Studies, execution, outside learners, file formats and the command line. */
package dev.touchstone.harness;
