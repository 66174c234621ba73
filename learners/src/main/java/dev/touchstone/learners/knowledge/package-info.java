/** Background knowledge by variable position, shared by the learners of every family. */
package dev.touchstone.learners.knowledge;
