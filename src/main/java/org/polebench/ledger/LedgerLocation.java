package org.polebench.ledger;

import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.polebench.InputProblem;

/**
 * Where the ledger lives, as the user named it with {@code --ledger}: an SQLite file (the
 * default, {@value #DEFAULT_FILE} in the working folder) or a PostgreSQL database
 * ({@code jdbc:postgresql://HOST[:PORT]/DB}). A PostgreSQL user and password come from the
 * environment ({@code PGUSER}, {@code PGPASSWORD}) or, for the password, from the user's
 * {@code .pgpass}, which the PostgreSQL driver reads itself; never from the command line, where
 * every other user of the machine could read them in the process list.
 *
 * @param kind     which database
 * @param url      the JDBC URL
 * @param file     the SQLite file; empty for PostgreSQL
 * @param user     the PostgreSQL user; empty for SQLite, or to let the driver choose
 * @param password the PostgreSQL password from {@code PGPASSWORD}; empty to let the driver read
 *                 {@code .pgpass}
 */
public record LedgerLocation(Kind kind, String url, Optional<Path> file, Optional<String> user,
                             Optional<String> password) {
    /** The ledger file when {@code --ledger} is not given. */
    public static final String DEFAULT_FILE = "polebench-ledger.db";
    private static final String POSTGRESQL = "jdbc:postgresql:";

    /** The two databases the ledger's schema runs on. */
    public enum Kind {
        SQLITE, POSTGRESQL
    }

    /** @return the location without its password, as messages may show it */
    @Override
    public String toString() {
        return kind == Kind.SQLITE ? file.orElseThrow().toString() : url;
    }

    /**
     * @param given       the {@code --ledger} value, or empty for the default file
     * @param environment the process environment ({@code System.getenv()}), for PGUSER and PGPASSWORD
     * @throws InputProblem when a PostgreSQL URL carries a user or password, or names no database
     */
    public static LedgerLocation parse(Optional<String> given, Map<String, String> environment) throws InputProblem {
        String text = given.orElse(DEFAULT_FILE).strip();
        if (text.isEmpty()) {
            throw new InputProblem(null, 0, "--ledger is empty", "name a file (" + DEFAULT_FILE
                    + ") or jdbc:postgresql://HOST/DB");
        }
        if (text.toLowerCase(Locale.ROOT).startsWith("jdbc:")) {
            if (!text.startsWith(POSTGRESQL + "//")) {
                throw new InputProblem(null, 0, "--ledger " + text + " is not a database polebench keeps its ledger in",
                        "give an SQLite file name, or jdbc:postgresql://HOST[:PORT]/DB");
            }
            int query = text.indexOf('?');
            String base = query < 0 ? text : text.substring(0, query);
            String lowered = text.toLowerCase(Locale.ROOT);
            if (lowered.contains("password=") || lowered.contains("user=") || base.contains("@")) {
                throw new InputProblem(null, 0, "--ledger names a user or password on the command line, where other "
                        + "users of the machine can read them",
                        "take them out of the URL and set PGUSER and PGPASSWORD in the environment, or keep the "
                                + "password in ~/.pgpass");
            }
            int slash = base.indexOf('/', (POSTGRESQL + "//").length());
            if (slash < 0 || slash == base.length() - 1) {
                throw new InputProblem(null, 0, "--ledger " + text + " names no database",
                        "write jdbc:postgresql://HOST[:PORT]/DB");
            }
            return new LedgerLocation(Kind.POSTGRESQL, text, Optional.empty(),
                    Optional.ofNullable(blankToNull(environment.get("PGUSER"))),
                    Optional.ofNullable(blankToNull(environment.get("PGPASSWORD"))));
        }
        Path file = Path.of(text);
        return new LedgerLocation(Kind.SQLITE, "jdbc:sqlite:" + file.toAbsolutePath(), Optional.of(file),
                Optional.empty(), Optional.empty());
    }

    private static String blankToNull(String value) {
        return value == null || value.isBlank() ? null : value;
    }
}
