/** Fitting structural models the generators can sample from to a data set over a given DAG, with perturbed variants and checks of the fit's assumptions. */
package dev.touchstone.generators.fit;
