package org.polebench.ledger;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicInteger;
import org.polebench.InputProblem;
import org.polebench.bench.Bench;
import org.polebench.bench.BenchReader;
import org.polebench.circuit.StageReader;
import org.polebench.lot.BoardOutcome;
import org.polebench.lot.BoardOutcome.Outcome;
import org.polebench.lot.OutcomeOfBoard;
import org.polebench.reconcile.ReconcileResult;
import org.polebench.reconcile.Reconciler;
import org.polebench.spread.StageAnalysis;
import org.polebench.spread.StagePrediction;
import org.polebench.spread.ToleranceSpread;
import org.polebench.sweepfile.ImportedSweep;
import org.polebench.sweepfile.SweepReader;
import org.polebench.sweepfile.SweepWriter;

/**
 * {@code polebench batch}: reconciles many sweeps of one stage in one JVM, several boards at once
 * (each on one thread of its own, {@link Reconciler#onOneThread()}, so that the boards, not the
 * parts of one reconcile, share the cores), and records each board in the ledger as soon as it
 * is done. The stage is analysed once for all boards.
 *
 * <p>A board whose test the ledger already holds (the same sweep file of the same stage) is not
 * reconciled again but counted with its recorded outcome: a batch that was stopped at any point
 * resumes by being run again, keeping the boards it finished and recording each of the others
 * once. A sweep that cannot be read or reconciled is recorded as an input problem, and the batch
 * goes on; run again, it is tried again, and a test that now reconciles takes its place.
 */
public final class BatchRunner {
    /** Boards drawn for the predicted tolerance spread, as {@code polebench reconcile} draws by default. */
    public static final int SPREAD_SAMPLES = 1000;

    private final OutcomeOfBoard outcomes = new OutcomeOfBoard();

    /**
     * @return the final tally
     * @throws InputProblem when the stage or the bench file is at fault (no board is taken then)
     * @throws IOException  when the stage or bench file cannot be read, or the ledger fails
     */
    public BatchTally run(BatchRequest request, Ledger ledger, ResultDocument document, BatchListener listener)
            throws InputProblem, IOException {
        // the reader first: a missing or bad stage file is the user's to fix, with its hint
        StagePrediction predicted = new StageAnalysis()
                .withSpread(new ToleranceSpread(SPREAD_SAMPLES, ToleranceSpread.DEFAULT_SEED))
                .analyse(new StageReader().read(request.stageFile()));
        byte[] stageBytes = Files.readAllBytes(request.stageFile());
        String stageSha = Sha256.of(stageBytes);
        String stageText = new String(stageBytes, StandardCharsets.UTF_8);
        Optional<Bench> bench = Optional.empty();
        Optional<String> benchText = Optional.empty();
        if (request.benchFile().isPresent()) {
            bench = Optional.of(new BenchReader().read(request.benchFile().get()));
            benchText = Optional.of(Files.readString(request.benchFile().get(), StandardCharsets.UTF_8));
        }
        Board board = new Board(request, ledger, document, predicted, bench, stageSha, stageText, benchText,
                new BoardNaming(request.boardPattern()));
        Progress progress = new Progress(request.sweepFiles().size(), listener);
        listener.started(request.sweepFiles().size());
        AtomicInteger number = new AtomicInteger();
        ExecutorService workers = Executors.newFixedThreadPool(request.threads(), runnable -> {
            Thread thread = new Thread(runnable, "polebench-batch-" + number.incrementAndGet());
            thread.setDaemon(true);
            return thread;
        });
        try {
            List<Future<?>> pending = new ArrayList<>();
            for (Path sweepFile : request.sweepFiles()) {
                pending.add(workers.submit(() -> {
                    board.test(sweepFile, progress);
                    return null;
                }));
            }
            for (Future<?> one : pending) {
                wait(one);
            }
        } finally {
            workers.shutdownNow();
        }
        return progress.tally();
    }

    private static void wait(Future<?> one) throws IOException {
        try {
            one.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("the batch was interrupted", e);
        } catch (ExecutionException e) {
            Throwable cause = e.getCause();
            if (cause instanceof UncheckedIOException) {
                throw ((UncheckedIOException) cause).getCause();
            }
            if (cause instanceof RuntimeException) {
                throw (RuntimeException) cause;
            }
            if (cause instanceof Error) {
                throw (Error) cause;
            }
            throw new IllegalStateException(cause);
        }
    }

    /** The counts, updated one board at a time. */
    private static final class Progress {
        private final BatchListener listener;
        private final long startNanos = System.nanoTime();
        private BatchTally tally;

        Progress(int boards, BatchListener listener) {
            this.listener = listener;
            this.tally = new BatchTally(boards, 0, 0, 0, 0, 0, Duration.ZERO);
        }

        synchronized void done(String boardId, Outcome outcome, boolean earlier) {
            tally = tally.with(outcome, earlier, Duration.ofNanos(System.nanoTime() - startNanos));
            listener.boardDone(tally, boardId, outcome, earlier);
        }

        synchronized BatchTally tally() {
            return tally;
        }
    }

    /** One board's test, from its file to its row; shared by the workers (it holds no per-board state). */
    private final class Board {
        private final BatchRequest request;
        private final Ledger ledger;
        private final ResultDocument document;
        private final StagePrediction predicted;
        private final Optional<Bench> bench;
        private final String stageSha;
        private final String stageText;
        private final Optional<String> benchText;
        private final BoardNaming naming;

        Board(BatchRequest request, Ledger ledger, ResultDocument document, StagePrediction predicted,
              Optional<Bench> bench, String stageSha, String stageText, Optional<String> benchText,
              BoardNaming naming) {
            this.request = request;
            this.ledger = ledger;
            this.document = document;
            this.predicted = predicted;
            this.bench = bench;
            this.stageSha = stageSha;
            this.stageText = stageText;
            this.benchText = benchText;
            this.naming = naming;
        }

        void test(Path sweepFile, Progress progress) {
            try {
                String sweepSha;
                try {
                    sweepSha = Files.isDirectory(sweepFile) ? folderSha(sweepFile)
                            : Sha256.of(Files.readAllBytes(sweepFile));
                } catch (IOException unreadable) {
                    // recorded as the input problem it is; its identity is its name, since its
                    // bytes are not to be had
                    sweepSha = Sha256.of(("unreadable " + sweepFile.toAbsolutePath()).getBytes(StandardCharsets.UTF_8));
                    record(sweepFile, sweepSha, Optional.empty(), new InputProblem(sweepFile, 0,
                            "cannot be read (" + unreadable.getMessage() + ")", "check the file and its permissions"),
                            progress);
                    return;
                }
                Optional<Ledger.Held> earlier = ledger.recorded(stageSha, sweepSha);
                // an input problem is tried again: an option may have caused it (a wrong profile)
                if (earlier.isPresent() && earlier.get().outcome() != Outcome.INPUT_PROBLEM) {
                    progress.done(earlier.get().boardId(), earlier.get().outcome(), true);
                    return;
                }
                ImportedSweep imported;
                try {
                    SweepReader reader = new SweepReader(request.profiles());
                    imported = Files.isDirectory(sweepFile) ? reader.read(List.of(sweepFile), request.profile())
                            : reader.read(sweepFile, request.profile());
                } catch (InputProblem problem) {
                    record(sweepFile, sweepSha, Optional.empty(), problem, progress);
                    return;
                }
                String boardId = naming.of(sweepFile, imported.sweep().source().board());
                ReconcileResult result;
                try {
                    result = Reconciler.onOneThread().reconcile(predicted, imported.sweep(), request.rule(), bench);
                } catch (InputProblem problem) {
                    record(sweepFile, sweepSha, Optional.of(imported), problem, progress);
                    return;
                }
                BoardOutcome outcome = outcomes.of(result, boardId, request.lot(), request.station(),
                        request.operator(), Instant.now());
                String json = document.of(result, request.stageFile(), sweepFile, imported, boardId);
                Recording done = ledger.record(new TestRecord(outcome, request.toolVersion(), stageSha, stageText,
                        sweepSha, sweepFile.toString(), Optional.of(canonical(imported)), benchText,
                        Optional.of(json)));
                progress.done(boardId, outcome.outcome(), done == Recording.ALREADY_RECORDED);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
        }

        private void record(Path sweepFile, String sweepSha, Optional<ImportedSweep> imported, InputProblem problem,
                            Progress progress) throws IOException {
            String boardId = naming.of(sweepFile, imported.flatMap(i -> i.sweep().source().board()));
            BoardOutcome outcome = outcomes.ofInputProblem(problem.describe(), boardId, request.lot(),
                    request.station(), request.operator(), Instant.now());
            Optional<String> text = imported.isPresent() ? Optional.of(canonical(imported.get())) : Optional.empty();
            Recording done = ledger.record(new TestRecord(outcome, request.toolVersion(), stageSha, stageText,
                    sweepSha, sweepFile.toString(), text, benchText, Optional.empty()));
            progress.done(boardId, Outcome.INPUT_PROBLEM, done == Recording.ALREADY_RECORDED);
        }

        /**
         * A folder of scope records is one sweep: its identity is every regular file in it, by
         * name and content (the SHA-256 of each name with its file's SHA-256, in name order), so
         * that a record added, changed or renamed makes a new test and an untouched folder does not.
         */
        private static String folderSha(Path folder) throws IOException {
            List<Path> files;
            try (java.util.stream.Stream<Path> entries = Files.list(folder)) {
                files = entries.filter(Files::isRegularFile)
                        .filter(f -> !f.getFileName().toString().startsWith(".")).sorted().toList();
            }
            StringBuilder listing = new StringBuilder("scope records\n");
            for (Path file : files) {
                listing.append(file.getFileName()).append('\0').append(Sha256.of(Files.readAllBytes(file))).append('\n');
            }
            return Sha256.of(listing.toString().getBytes(StandardCharsets.UTF_8));
        }

        private String canonical(ImportedSweep imported) throws IOException {
            StringWriter text = new StringWriter();
            new SweepWriter().canonical(imported.sweep(), text);
            return text.toString();
        }
    }
}
