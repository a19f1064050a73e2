package org.polebench.ledger;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.polebench.InputProblem;

class LedgerLocationTest {
    @Test
    void theDefaultIsAnSqliteFileInTheWorkingFolder() throws InputProblem {
        LedgerLocation location = LedgerLocation.parse(Optional.empty(), Map.of());
        assertEquals(LedgerLocation.Kind.SQLITE, location.kind());
        assertEquals(Optional.of(Path.of("polebench-ledger.db")), location.file());
        assertEquals("jdbc:sqlite:" + Path.of("polebench-ledger.db").toAbsolutePath(), location.url());
    }

    @Test
    void postgresqlTakesItsCredentialsFromTheEnvironmentAndNeverShowsThem() throws InputProblem {
        LedgerLocation location = LedgerLocation.parse(Optional.of("jdbc:postgresql://db.local:5433/line1"),
                Map.of("PGUSER", "station", "PGPASSWORD", "secret"));
        assertEquals(LedgerLocation.Kind.POSTGRESQL, location.kind());
        assertEquals(Optional.of("station"), location.user());
        assertEquals(Optional.of("secret"), location.password());
        assertFalse(location.toString().contains("secret"));
        // no PGPASSWORD: the driver reads ~/.pgpass itself
        assertEquals(Optional.empty(),
                LedgerLocation.parse(Optional.of("jdbc:postgresql://db/line1"), Map.of()).password());
    }

    @Test
    void credentialsOnTheCommandLineAreRefused() {
        for (String url : new String[] {"jdbc:postgresql://db/line1?password=x", "jdbc:postgresql://db/l?user=me",
                "jdbc:postgresql://me:x@db/line1"}) {
            InputProblem problem = assertThrows(InputProblem.class,
                    () -> LedgerLocation.parse(Optional.of(url), Map.of()), url);
            assertTrue(problem.hint().contains("PGPASSWORD"), problem.hint());
        }
        assertThrows(InputProblem.class, () -> LedgerLocation.parse(Optional.of("jdbc:postgresql://db/"), Map.of()));
        assertThrows(InputProblem.class, () -> LedgerLocation.parse(Optional.of("jdbc:mysql://db/x"), Map.of()));
    }
}
