/** Ranking learner configurations over the settings of a study: mean ranks, the Friedman test and the Nemenyi critical difference (Demšar 2006). */
package dev.touchstone.metrics.rank;
