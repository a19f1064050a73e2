/**
 * A YAML document read into a small tree that remembers the line of every key and value,
 * so that stage files and instrument profiles can name the line at fault. Uses only the root
 * package; Jackson's streaming YAML parser does the reading.
 */
package org.polebench.yaml;
