package org.polebench.synth;

import java.io.IOException;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.ServerSocket;
import java.net.Socket;
import java.net.SocketTimeoutException;
import java.util.ArrayList;
import java.util.Collection;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.BooleanSupplier;
import org.polebench.capture.LineTransport;
import org.polebench.capture.TcpLine;
import org.polebench.profile.PortSettings;

/**
 * Serves one {@link InstrumentSimulator.Session} where a bench can reach it: on every line of a
 * bench at once (a thread per line, until any line ends, since the bench is gone when any of
 * its lines is), or on TCP connections accepted one after another. Prints nothing: what
 * happens is told to a {@link Listener}.
 */
public final class SimulatorServer {
    /** How long one wait for a connection lasts before the stop request is looked at again, in ms. */
    private static final int ACCEPT_SLICE_MS = 200;
    /** How long each other line's thread is given to stop after the first line ended, in ms. */
    private static final long JOIN_MS = 5_000;

    private final InstrumentSimulator.Session session;

    public SimulatorServer(InstrumentSimulator.Session session) {
        this.session = session;
    }

    /** What a serving simulator reports; called on the serving threads, so a listener must be thread-safe. */
    public interface Listener {
        /** The server listens on that address ({@code host:port}). */
        default void listening(String address) {
        }

        /** Serving on a line or connection ended, and how. */
        void ended(String lineDescription, InstrumentSimulator.End end);
    }

    /**
     * Serves every distinct line (a line shared by several instruments is served once) until
     * one of them ends, then stops the others.
     *
     * @param stop polled by each line's serving loop; true stops all of them
     * @throws IOException when serving a line failed
     */
    public void serveLines(Collection<LineTransport> lines, BooleanSupplier stop, Listener listener) throws IOException {
        Map<LineTransport, Boolean> started = new IdentityHashMap<>();
        List<Thread> threads = new ArrayList<>();
        AtomicBoolean anyEnded = new AtomicBoolean();
        AtomicReference<IOException> failure = new AtomicReference<>();
        CountDownLatch ended = new CountDownLatch(1);
        for (LineTransport link : lines) {
            if (started.put(link, Boolean.TRUE) != null) {
                continue;
            }
            Thread thread = new Thread(() -> {
                try {
                    InstrumentSimulator.End end = session.serve(link, () -> anyEnded.get() || stop.getAsBoolean(),
                            sent -> { });
                    listener.ended(link.describe(), end);
                } catch (IOException e) {
                    failure.set(e);
                } finally {
                    ended.countDown();
                }
            }, "simulate " + link.describe());
            thread.start();
            threads.add(thread);
        }
        try {
            ended.await();
            anyEnded.set(true);
            for (Thread thread : threads) {
                thread.join(JOIN_MS);
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        if (failure.get() != null) {
            throw failure.get();
        }
    }

    /**
     * Listens on {@code host:port} and serves the connections one after another, until the
     * stop request, or after the first when {@code once}.
     *
     * @param port   0 picks a free port, told to the listener
     * @param ending the line ending of the profile's port
     * @throws IOException when the address cannot be bound or a connection fails
     */
    public void serveTcp(String host, int port, boolean once, PortSettings.LineEnding ending, BooleanSupplier stop,
                         Listener listener) throws IOException {
        try (ServerSocket server = new ServerSocket()) {
            server.bind(new InetSocketAddress(InetAddress.getByName(host), port), 1);
            server.setSoTimeout(ACCEPT_SLICE_MS);
            listener.listening(server.getInetAddress().getHostAddress() + ":" + server.getLocalPort());
            while (!stop.getAsBoolean()) {
                Socket socket;
                try {
                    socket = server.accept();
                } catch (SocketTimeoutException e) {
                    continue;
                }
                try (TcpLine line = TcpLine.accepted(socket, ending)) {
                    InstrumentSimulator.End end = session.serve(line, stop, sent -> { });
                    listener.ended(line.describe(), end);
                }
                if (once) {
                    break;
                }
            }
        }
    }
}
