package org.polebench.capture;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.InetSocketAddress;
import java.net.Socket;
import java.net.SocketTimeoutException;
import java.nio.charset.StandardCharsets;
import java.util.Optional;
import org.polebench.profile.PortSettings;

/**
 * A raw TCP socket to a networked instrument: SCPI lines over a plain stream, with the
 * profile's line ending (the "raw socket" service LAN instruments commonly offer on port
 * 5025; common practice). Nagle's algorithm is off, since every line is a complete message
 * awaited by the far end.
 */
public final class TcpLine implements LineTransport {
    private static final int SLICE_MS = 50;

    private final Socket socket;
    private final InputStream in;
    private final OutputStream out;
    private final PortSettings.LineEnding ending;
    private final LineAssembler assembler;
    private final byte[] buffer = new byte[4096];
    private final String name;
    private boolean lost;
    private boolean closed;

    private TcpLine(Socket socket, PortSettings.LineEnding ending) throws IOException {
        this.socket = socket;
        this.ending = ending;
        this.assembler = new LineAssembler(ending);
        socket.setTcpNoDelay(true);
        socket.setSoTimeout(SLICE_MS);
        this.in = socket.getInputStream();
        this.out = socket.getOutputStream();
        this.name = "tcp " + socket.getInetAddress().getHostAddress() + ":" + socket.getPort();
    }

    /**
     * Connects to {@code host:port}.
     *
     * @param connectTimeoutMs how long to wait for the connection, in milliseconds
     * @throws IOException when nothing answers there
     */
    public static TcpLine connect(String host, int port, PortSettings.LineEnding ending, int connectTimeoutMs)
            throws IOException {
        Socket socket = new Socket();
        try {
            socket.connect(new InetSocketAddress(host, port), connectTimeoutMs);
        } catch (IOException e) {
            socket.close();
            throw new IOException("cannot connect to " + host + ":" + port + " (" + e.getMessage()
                    + "); is the instrument on the network and its raw-socket service on?", e);
        }
        return new TcpLine(socket, ending);
    }

    /** Wraps a socket accepted by a server (the simulator's side). */
    public static TcpLine accepted(Socket socket, PortSettings.LineEnding ending) throws IOException {
        return new TcpLine(socket, ending);
    }

    @Override
    public String describe() {
        return name;
    }

    @Override
    public boolean local() {
        return socket.getInetAddress().isLoopbackAddress();
    }

    @Override
    public void send(String line) throws IOException {
        if (lost || closed) {
            throw new PortLostException(name + " is closed");
        }
        try {
            out.write((line + ending.text()).getBytes(StandardCharsets.UTF_8));
            out.flush();
        } catch (IOException e) {
            lost = true;
            throw new PortLostException(name + " was closed by the far end (" + e.getMessage() + ")");
        }
    }

    @Override
    public Optional<String> receive(long timeoutMs) throws IOException {
        long deadline = System.nanoTime() + timeoutMs * 1_000_000L;
        while (true) {
            Optional<String> line = assembler.next();
            if (line.isPresent()) {
                return line;
            }
            if (lost || closed) {
                throw new PortLostException(name + " was closed by the far end");
            }
            if (timeoutMs == 0 && in.available() == 0) {
                return Optional.empty();
            }
            if (timeoutMs > 0 && System.nanoTime() >= deadline) {
                return Optional.empty();
            }
            int n;
            try {
                n = in.read(buffer);
            } catch (SocketTimeoutException e) {
                continue;
            } catch (IOException e) {
                n = -1;
            }
            if (n < 0) {
                lost = true;
                continue;
            }
            assembler.accept(buffer, n);
        }
    }

    @Override
    public Optional<BlockAnswer> receiveBlock(long timeoutMs) throws IOException {
        assembler.expectBlock();
        long deadline = System.nanoTime() + timeoutMs * 1_000_000L;
        while (true) {
            Optional<BlockAnswer> block = assembler.nextBlock();
            if (block.isPresent()) {
                return block;
            }
            if (lost || closed) {
                assembler.abandonBlock();
                throw new PortLostException(name + " was closed by the far end");
            }
            if (System.nanoTime() >= deadline) {
                return assembler.abandonBlock().map(BlockAnswer::refused);
            }
            int n;
            try {
                n = in.read(buffer);
            } catch (SocketTimeoutException e) {
                continue;
            } catch (IOException e) {
                n = -1;
            }
            if (n < 0) {
                lost = true;
                continue;
            }
            assembler.accept(buffer, n);
        }
    }

    @Override
    public void sendBytes(byte[] bytes) throws IOException {
        if (lost || closed) {
            throw new PortLostException(name + " is closed");
        }
        try {
            out.write(bytes);
            out.flush();
        } catch (IOException e) {
            lost = true;
            throw new PortLostException(name + " was closed by the far end (" + e.getMessage() + ")");
        }
    }

    @Override
    public String discardUnfinished() {
        return assembler.discardUnfinished();
    }

    @Override
    public String unfinishedLine() {
        return assembler.unfinished();
    }

    @Override
    public void close() {
        if (!closed) {
            closed = true;
            try {
                socket.close();
            } catch (IOException e) {
                // closing a socket that failed already: nothing more to release
            }
        }
    }
}
