package org.polebench.ledger;

import static org.junit.jupiter.api.Assumptions.abort;

import java.io.IOException;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.UserPrincipal;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Properties;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

/**
 * A PostgreSQL cluster of the test's own: initdb and pg_ctl in a temporary folder, listening on
 * a free loopback port and a socket in that folder, with password authentication for one user.
 * The distribution's {@code postgresql} package provides the binaries ({@code .ci/run} installs
 * it) in {@code /usr/lib/postgresql/<version>/bin}, or they are on the PATH. initdb refuses to
 * run as root, so as root the cluster is made and run as the {@code postgres} system user,
 * which the package creates, in a folder handed to that user. Without binaries the test is
 * skipped and says why.
 */
final class ThrowawayPostgres implements AutoCloseable {
    static final String USER = "polebench";
    static final String PASSWORD = "ledger-test-only";
    static final String DATABASE = "ledger";

    private final Path binaries;
    private final Path folder;
    private final boolean asPostgres;
    private final int port;

    private ThrowawayPostgres(Path binaries, Path folder, boolean asPostgres, int port) {
        this.binaries = binaries;
        this.folder = folder;
        this.asPostgres = asPostgres;
        this.port = port;
    }

    /** Starts a cluster and creates the test database; aborts the test when no server binaries exist. */
    static ThrowawayPostgres start() throws IOException, InterruptedException, SQLException {
        Optional<Path> binaries = binaries();
        if (binaries.isEmpty()) {
            abort("no PostgreSQL server binaries (initdb, pg_ctl) on the PATH or in /usr/lib/postgresql/*/bin: "
                    + "install the distribution's postgresql package, as .ci/run does");
        }
        boolean root = "root".equals(System.getProperty("user.name"));
        Path folder = Files.createTempDirectory("polebench-pg");
        ThrowawayPostgres server = new ThrowawayPostgres(binaries.get(), folder, root, freePort());
        try {
            server.initialise();
            return server;
        } catch (IOException | InterruptedException | SQLException | RuntimeException e) {
            server.close();
            throw e;
        }
    }

    /** @return the ledger URL of the test database */
    String url() {
        return "jdbc:postgresql://127.0.0.1:" + port + "/" + DATABASE;
    }

    /** @return the environment a ledger user is given: PGUSER and PGPASSWORD */
    Map<String, String> environment() {
        return Map.of("PGUSER", USER, "PGPASSWORD", PASSWORD);
    }

    /** @return a connection to the test database, outside the ledger, for checks */
    Connection connect() throws SQLException {
        Properties properties = new Properties();
        properties.setProperty("user", USER);
        properties.setProperty("password", PASSWORD);
        return DriverManager.getConnection(url(), properties);
    }

    private void initialise() throws IOException, InterruptedException, SQLException {
        Path passwordFile = folder.resolve("password");
        Files.writeString(passwordFile, PASSWORD + "\n", StandardCharsets.UTF_8);
        if (asPostgres) {
            UserPrincipal postgres = folder.getFileSystem().getUserPrincipalLookupService()
                    .lookupPrincipalByName("postgres");
            Files.setOwner(folder, postgres);
            Files.setOwner(passwordFile, postgres);
        }
        Path data = folder.resolve("data");
        run(List.of(binaries.resolve("initdb").toString(), "-D", data.toString(), "-U", USER, "-E", "UTF8",
                "--no-locale", "--auth=scram-sha-256", "--pwfile=" + passwordFile, "--no-sync"));
        // a loopback port and a socket in the folder: no system socket directory is needed, and
        // nothing outside this machine can reach the cluster
        run(List.of(binaries.resolve("pg_ctl").toString(), "-D", data.toString(), "-l",
                folder.resolve("server.log").toString(), "-w", "-t", "60", "-o",
                "-p " + port + " -k " + folder + " -c listen_addresses=127.0.0.1 -c fsync=off", "start"));
        Properties properties = new Properties();
        properties.setProperty("user", USER);
        properties.setProperty("password", PASSWORD);
        try (Connection admin = DriverManager.getConnection("jdbc:postgresql://127.0.0.1:" + port + "/postgres",
                properties); Statement statement = admin.createStatement()) {
            statement.execute("CREATE DATABASE " + DATABASE);
        }
    }

    @Override
    public void close() throws IOException, InterruptedException {
        try {
            if (Files.exists(folder.resolve("data").resolve("postmaster.pid"))) {
                run(List.of(binaries.resolve("pg_ctl").toString(), "-D", folder.resolve("data").toString(), "-m",
                        "immediate", "-w", "stop"));
            }
        } finally {
            try (Stream<Path> all = Files.walk(folder)) {
                for (Path path : all.sorted(Comparator.reverseOrder()).toList()) {
                    Files.deleteIfExists(path);
                }
            }
        }
    }

    private void run(List<String> command) throws IOException, InterruptedException {
        List<String> line = new ArrayList<>();
        if (asPostgres) {
            line.addAll(List.of("runuser", "-u", "postgres", "--"));
        }
        line.addAll(command);
        Path log = Files.createTempFile("polebench-pg", ".log");
        try {
            Process process = new ProcessBuilder(line).redirectErrorStream(true).redirectOutput(log.toFile()).start();
            if (!process.waitFor(120, TimeUnit.SECONDS)) {
                process.destroyForcibly();
                throw new IOException(String.join(" ", command) + " did not finish in 120 s");
            }
            if (process.exitValue() != 0) {
                throw new IOException(String.join(" ", command) + " exited " + process.exitValue() + ": "
                        + Files.readString(log));
            }
        } finally {
            Files.deleteIfExists(log);
        }
    }

    private static Optional<Path> binaries() throws IOException {
        String path = System.getenv("PATH");
        if (path != null) {
            for (String entry : path.split(java.io.File.pathSeparator)) {
                Path candidate = Path.of(entry).resolve("pg_ctl");
                if (Files.isExecutable(candidate) && Files.isExecutable(Path.of(entry).resolve("initdb"))) {
                    return Optional.of(candidate.toRealPath().getParent());
                }
            }
        }
        Path installed = Path.of("/usr/lib/postgresql");
        if (!Files.isDirectory(installed)) {
            return Optional.empty();
        }
        try (Stream<Path> versions = Files.list(installed)) {
            return versions.map(v -> v.resolve("bin"))
                    .filter(bin -> Files.isExecutable(bin.resolve("initdb")) && Files.isExecutable(bin.resolve("pg_ctl")))
                    .max(Comparator.comparing(bin -> versionOf(bin.getParent().getFileName().toString())));
        }
    }

    private static int versionOf(String name) {
        try {
            return Integer.parseInt(name);
        } catch (NumberFormatException e) {
            return -1;
        }
    }

    private static int freePort() throws IOException {
        try (ServerSocket socket = new ServerSocket(0, 1, java.net.InetAddress.getLoopbackAddress())) {
            return socket.getLocalPort();
        }
    }
}
