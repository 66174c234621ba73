/** Background knowledge: required and forbidden edges, tiers of a temporal order. */
package dev.touchstone.core.knowledge;
