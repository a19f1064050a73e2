package org.polebench.ledger;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;

/** Starts {@link ConcurrentWriter} processes on the test classpath, all at once, and collects what each recorded. */
final class WriterProcesses {
    private WriterProcesses() {
    }

    /** @return per process, how many boards it was the one to record */
    static List<Integer> run(String ledger, Map<String, String> environment, int processes, int boards)
            throws IOException, InterruptedException {
        return run(ledger, environment, processes, boards, "concurrent");
    }

    /** @return per process, how many boards of the lot it was the one to record */
    static List<Integer> run(String ledger, Map<String, String> environment, int processes, int boards, String lot)
            throws IOException, InterruptedException {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<Process> started = new ArrayList<>();
        for (int i = 0; i < processes; i++) {
            ProcessBuilder builder = new ProcessBuilder(java, "-Xshare:auto", "-XX:TieredStopAtLevel=1", "-cp",
                    System.getProperty("java.class.path"), ConcurrentWriter.class.getName(), ledger,
                    Integer.toString(boards), Integer.toString(i + 1), lot);
            // the environment as a station would have it: PGPASSWORD or PGPASSFILE, never both from here
            builder.environment().remove("PGPASSWORD");
            builder.environment().remove("PGPASSFILE");
            builder.environment().putAll(environment);
            builder.redirectError(ProcessBuilder.Redirect.DISCARD);
            started.add(builder.start());
        }
        List<Integer> recorded = new ArrayList<>();
        for (Process process : started) {
            if (!process.waitFor(120, TimeUnit.SECONDS)) {
                started.forEach(Process::destroyForcibly);
                throw new IOException("a writer process did not finish in 120 s");
            }
            String out = new String(process.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
            if (process.exitValue() != 0) {
                throw new IOException("a writer process exited " + process.exitValue() + ": " + out);
            }
            recorded.add(Integer.parseInt(out));
        }
        return recorded;
    }
}
