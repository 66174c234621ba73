/** Built-in reference networks with fixed conditional tables: chest clinic, sprinkler, and an invented community-garden network. */
package dev.touchstone.generators.networks;
