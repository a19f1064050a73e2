package org.polebench.ledger;

import org.flywaydb.core.api.logging.Log;
import org.flywaydb.core.api.logging.LogCreator;

/**
 * Flyway's log, kept quiet. Left to itself Flyway writes its progress through java.util.logging
 * to the error stream of whatever command opened the ledger; polebench's library prints nothing,
 * and a failed migration reaches the user as the exception it throws. Flyway instantiates this by
 * name ({@code loggers} in its configuration), so it needs a public no-argument constructor.
 */
public final class SilentFlywayLog implements LogCreator, Log {
    @Override
    public Log createLogger(Class<?> type) {
        return this;
    }

    @Override
    public boolean isDebugEnabled() {
        return false;
    }

    @Override
    public void debug(String message) {
    }

    @Override
    public void info(String message) {
    }

    @Override
    public void warn(String message) {
    }

    @Override
    public void error(String message) {
    }

    @Override
    public void error(String message, Exception e) {
    }

    @Override
    public void notice(String message) {
    }
}
