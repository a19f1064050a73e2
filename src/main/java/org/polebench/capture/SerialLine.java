package org.polebench.capture;

import com.fazecast.jSerialComm.SerialPort;
import com.fazecast.jSerialComm.SerialPortInvalidPortException;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import org.polebench.profile.PortSettings;

/**
 * A serial port through jSerialComm, with the profile's line settings.
 *
 * <p>jSerialComm's own read timeouts are loose (a 500 ms read took about 850 ms here), so
 * reads are made in short semi-blocking slices against a deadline of our own; after the far
 * end vanishes a read returns −1 while the port still claims to be open, which is how a lost
 * port is told (docs/contributing.md, "Library behaviour the code works around"). A pseudo-terminal has no line settings, so the
 * error code 25 (ENOTTY) that follows a successful open is not a failure there.
 */
public final class SerialLine implements LineTransport {
    /** One read slice: short enough to notice a stop request, long enough not to spin. */
    private static final int SLICE_MS = 50;

    private final SerialPort port;
    private final String path;
    private final PortSettings settings;
    private final LineAssembler assembler;
    private final byte[] buffer = new byte[4096];
    private final boolean pseudoTerminal;
    private boolean lost;
    private boolean closed;

    private SerialLine(SerialPort port, String path, PortSettings settings, boolean pseudoTerminal) {
        this.port = port;
        this.path = path;
        this.settings = settings;
        this.assembler = new LineAssembler(settings.lineEnding());
        this.pseudoTerminal = pseudoTerminal;
    }

    /**
     * Opens the port exclusively.
     *
     * @param path a device path such as {@code /dev/ttyUSB0}, a symbolic link to one, or a
     *             Windows name such as {@code COM3}
     * @throws IOException when the port does not exist, is in use or may not be opened; the
     *                     message says which and what to do
     */
    public static SerialLine open(String path, PortSettings settings) throws IOException {
        boolean pseudo = false;
        Path file = Path.of(path);
        if (path.startsWith("/")) {
            if (!Files.exists(file)) {
                throw new IOException("serial port " + path + " does not exist; check the path (is the adapter plugged in?)");
            }
            pseudo = file.toRealPath().toString().startsWith("/dev/pts/");
        }
        SerialPort port;
        try {
            port = SerialPort.getCommPort(path);
        } catch (SerialPortInvalidPortException e) {
            throw new IOException("serial port " + path + " cannot be used: " + e.getMessage());
        }
        port.setComPortParameters(settings.baud(), settings.dataBits(), stopBits(settings.stopBits()),
                parity(settings.parity()));
        port.setComPortTimeouts(SerialPort.TIMEOUT_READ_SEMI_BLOCKING | SerialPort.TIMEOUT_WRITE_BLOCKING, SLICE_MS,
                2000);
        if (!port.openPort()) {
            int code = port.getLastErrorCode();
            if (code == 13) {
                throw new IOException("serial port " + path + ": permission denied; on Debian and Ubuntu add yourself "
                        + "to the dialout group (sudo usermod -aG dialout $USER) and log in again");
            }
            throw new IOException("serial port " + path + " could not be opened (error " + code
                    + "); is another program using it? Ports are opened exclusively");
        }
        return new SerialLine(port, path, settings, pseudo);
    }

    private static int stopBits(double stopBits) {
        if (stopBits == 1) {
            return SerialPort.ONE_STOP_BIT;
        }
        return stopBits == 1.5 ? SerialPort.ONE_POINT_FIVE_STOP_BITS : SerialPort.TWO_STOP_BITS;
    }

    private static int parity(PortSettings.Parity parity) {
        switch (parity) {
            case EVEN:
                return SerialPort.EVEN_PARITY;
            case ODD:
                return SerialPort.ODD_PARITY;
            case MARK:
                return SerialPort.MARK_PARITY;
            case SPACE:
                return SerialPort.SPACE_PARITY;
            default:
                return SerialPort.NO_PARITY;
        }
    }

    @Override
    public String describe() {
        return "serial " + path + (pseudoTerminal ? " (pseudo-terminal)" : "") + ", " + settings.baud() + " baud";
    }

    @Override
    public boolean local() {
        return pseudoTerminal;
    }

    @Override
    public void send(String line) throws IOException {
        sendBytes((line + settings.lineEnding().text()).getBytes(StandardCharsets.UTF_8));
    }

    @Override
    public void sendBytes(byte[] bytes) throws IOException {
        if (lost || closed) {
            throw new PortLostException("serial port " + path + " is gone");
        }
        int written = 0;
        while (written < bytes.length) {
            int n = port.writeBytes(bytes, bytes.length - written, written);
            if (n <= 0) {
                lost = true;
                throw new PortLostException("serial port " + path + " stopped taking data (unplugged or closed)");
            }
            written += n;
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
                throw new PortLostException("serial port " + path + " is gone");
            }
            long leftMs = (deadline - System.nanoTime()) / 1_000_000L;
            if (leftMs <= 0 && timeoutMs > 0) {
                return Optional.empty();
            }
            int n = port.bytesAvailable() > 0 || timeoutMs > 0
                    ? port.readBytes(buffer, buffer.length) : 0;
            if (n < 0) {
                lost = true;
                continue;   // hand out any complete line first; then report the loss
            }
            assembler.accept(buffer, n);
            if (n == 0 && timeoutMs == 0) {
                return assembler.next();
            }
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
                throw new PortLostException("serial port " + path + " is gone");
            }
            if (System.nanoTime() >= deadline) {
                return assembler.abandonBlock().map(BlockAnswer::refused);
            }
            int n = port.readBytes(buffer, buffer.length);
            if (n < 0) {
                lost = true;
                continue;
            }
            assembler.accept(buffer, n);
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
            port.closePort();
        }
    }
}
