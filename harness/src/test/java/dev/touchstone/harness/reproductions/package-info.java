/** Tests that run the bundled reproductions of published simulation studies at reduced scale and check their findings. */
package dev.touchstone.harness.reproductions;
