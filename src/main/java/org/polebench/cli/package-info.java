/**
 * The picocli command line: parses options, calls the library, prints results through the
 * writers it is handed and maps problems to exit codes. No computation lives here. May use
 * every package.
 */
package org.polebench.cli;
