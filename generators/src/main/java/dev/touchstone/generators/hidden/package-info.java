/** Options that flag variables of a true DAG as hidden, so data omit them while the truth keeps them. */
package dev.touchstone.generators.hidden;
