/**
 * The picocli command line: parses options, calls the library, prints results through the
 * writers it is handed and maps problems to exit codes. No computation lives here.
 */
package org.polebench.cli;
