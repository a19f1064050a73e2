package org.polebench.ledger;

import java.io.PrintWriter;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.SQLFeatureNotSupportedException;
import java.util.logging.Logger;
import javax.sql.DataSource;

/**
 * The ledger's connections as a {@link DataSource}, for Flyway: its migrations then connect as
 * the ledger does (SQLite's busy timeout and WAL mode; the PostgreSQL user, and a password from
 * the environment or left to the driver's {@code .pgpass}), not through a second reading of the
 * location.
 */
final class LedgerDataSource implements DataSource {
    private final LedgerLocation location;

    LedgerDataSource(LedgerLocation location) {
        this.location = location;
    }

    @Override
    public Connection getConnection() throws SQLException {
        return Ledger.connect(location);
    }

    @Override
    public Connection getConnection(String user, String password) throws SQLException {
        throw new SQLFeatureNotSupportedException("the ledger's user and password come from its location");
    }

    @Override
    public PrintWriter getLogWriter() {
        return null;
    }

    @Override
    public void setLogWriter(PrintWriter out) {
        // the ledger writes no driver log
    }

    @Override
    public void setLoginTimeout(int seconds) {
        // the drivers' own timeouts apply
    }

    @Override
    public int getLoginTimeout() {
        return 0;
    }

    @Override
    public Logger getParentLogger() throws SQLFeatureNotSupportedException {
        throw new SQLFeatureNotSupportedException("no java.util.logging parent");
    }

    @Override
    public <T> T unwrap(Class<T> type) throws SQLException {
        if (type.isInstance(this)) {
            return type.cast(this);
        }
        throw new SQLException("not a wrapper of " + type.getName());
    }

    @Override
    public boolean isWrapperFor(Class<?> type) {
        return type.isInstance(this);
    }
}
