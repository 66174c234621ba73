/** Reading and writing the product's files: data CSV, graph JSON/CSV/DOT, knowledge YAML/JSON, all written atomically. */
package dev.touchstone.harness.io;
