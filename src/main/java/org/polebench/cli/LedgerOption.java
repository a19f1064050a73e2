package org.polebench.cli;

import java.nio.file.Files;
import java.util.Optional;
import org.polebench.InputProblem;
import org.polebench.ledger.LedgerLocation;
import picocli.CommandLine.Option;

/**
 * The {@code --ledger} option of every command that reads or writes the results ledger (a
 * picocli mixin): an SQLite file, by default {@value LedgerLocation#DEFAULT_FILE} in the working
 * folder, or a PostgreSQL URL whose user and password come from the environment.
 */
final class LedgerOption {
    @Option(names = "--ledger", paramLabel = "L",
            description = "the ledger: an SQLite file (default " + LedgerLocation.DEFAULT_FILE + " here) or "
                    + "jdbc:postgresql://HOST[:PORT]/DB, with PGUSER and PGPASSWORD from the environment or the "
                    + "password in ~/.pgpass")
    String ledger;

    /** @return where the ledger is; an SQLite file is created by the first batch that records */
    LedgerLocation location() throws InputProblem {
        return LedgerLocation.parse(Optional.ofNullable(ledger), System.getenv());
    }

    /**
     * @return where the ledger is, for a command that only reads it
     * @throws InputProblem when the ledger is an SQLite file that does not exist (reading must not
     *                      create an empty one)
     */
    LedgerLocation existing() throws InputProblem {
        LedgerLocation location = location();
        if (location.file().isPresent() && !Files.exists(location.file().get())) {
            throw new InputProblem(location.file().get(), 0, "no ledger here",
                    "run polebench batch first, or name the ledger with --ledger");
        }
        return location;
    }
}
