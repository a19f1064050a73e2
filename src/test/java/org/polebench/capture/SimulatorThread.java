package org.polebench.capture;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;
import org.polebench.synth.InstrumentSimulator;

/** Runs an {@link InstrumentSimulator} session on one line in a thread of its own, for tests. */
final class SimulatorThread implements AutoCloseable {
    private final Thread thread;
    private final AtomicBoolean stop = new AtomicBoolean();
    private final List<String> sent = Collections.synchronizedList(new ArrayList<>());
    private final AtomicReference<Object> end = new AtomicReference<>();
    private final LineTransport line;

    SimulatorThread(InstrumentSimulator.Session session, LineTransport line) {
        this.line = line;
        this.thread = new Thread(() -> {
            try {
                end.set(session.serve(line, stop::get, sent::add));
            } catch (IOException | RuntimeException e) {
                end.set(e);
            } finally {
                line.close();
            }
        }, "simulator");
        thread.setDaemon(true);
        thread.start();
    }

    /** @return every line the simulator sent, in order */
    List<String> sent() {
        synchronized (sent) {
            return List.copyOf(sent);
        }
    }

    /** @return how serving ended (an {@link InstrumentSimulator.End} or an exception), null while it runs */
    Object end() {
        return end.get();
    }

    boolean awaitEnd(long millis) throws InterruptedException {
        thread.join(TimeUnit.MILLISECONDS.toMillis(millis));
        return !thread.isAlive();
    }

    /** Stops serving and closes the line; interrupted while waiting, it keeps the thread's interrupt. */
    @Override
    public void close() {
        stop.set(true);
        try {
            thread.join(10_000);
        } catch (InterruptedException interrupted) {
            Thread.currentThread().interrupt();
        }
        line.close();
    }
}
