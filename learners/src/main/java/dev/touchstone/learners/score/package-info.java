/** Score-based learners (GES, hill climbing) and the decomposable local scores they search with (BIC, extended BIC, BDeu, conditional Gaussian BIC). */
package dev.touchstone.learners.score;
