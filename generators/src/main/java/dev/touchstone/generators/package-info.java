/** Known truths: random graph families, structural-equation models, hidden and missing mechanisms, reference networks, sortability audit. */
package dev.touchstone.generators;
