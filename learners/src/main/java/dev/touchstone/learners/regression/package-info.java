/** Sparse regression shared by learners of several families: the adaptive Lasso on a covariance matrix, its penalty chosen by BIC. */
package dev.touchstone.learners.regression;

