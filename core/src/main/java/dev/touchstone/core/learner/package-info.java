/** The Learner plug-in interface: self-description, input (data or oracle), run context and estimate. */
package dev.touchstone.core.learner;
