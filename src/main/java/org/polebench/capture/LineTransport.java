package org.polebench.capture;

import java.io.Closeable;
import java.io.IOException;
import java.util.Optional;

/**
 * A line-oriented link to an instrument: a serial port ({@link SerialLine}) or a raw TCP
 * socket ({@link TcpLine}, the form networked instruments offer, commonly on port 5025).
 * Lines go out with the profile's line ending; lines come in split at it, decoded as UTF-8
 * with undecodable bytes replaced (line noise or a wrong baud rate), so a garbled line is
 * still a line to log.
 *
 * <p>One transport belongs to one thread at a time.
 */
public sealed interface LineTransport extends Closeable permits SerialLine, TcpLine {

    /** @return what the link is, for messages and the transcript, such as {@code serial /dev/ttyUSB0} */
    String describe();

    /**
     * @return true when the far end is on this machine (a pseudo-terminal or a loopback
     *         socket), so no instrument of the bench is behind it
     */
    boolean local();

    /**
     * Sends one line and its line ending.
     *
     * @throws PortLostException when the port or connection is gone
     */
    void send(String line) throws IOException;

    /**
     * Waits for the next complete line.
     *
     * @param timeoutMs how long to wait, in milliseconds; 0 only takes a line already received
     * @return the line without its ending, or empty when none is complete within the time
     * @throws PortLostException when the port or connection is gone (any partial line is then
     *                           in {@link #unfinishedLine()})
     */
    Optional<String> receive(long timeoutMs) throws IOException;

    /**
     * Waits for the next answer as an IEEE 488.2 definite-length block, read by its length
     * prefix (its bytes may hold the line ending), the line ending after it dropped.
     *
     * @param timeoutMs how long to wait for the whole block, in milliseconds
     * @return the block, or why the answer is not one (also a block cut short by the time);
     *         empty when nothing arrived within the time
     * @throws PortLostException when the port or connection is gone
     */
    Optional<BlockAnswer> receiveBlock(long timeoutMs) throws IOException;

    /**
     * Sends bytes as they are, without a line ending (a block, by the simulator's side).
     *
     * @throws PortLostException when the port or connection is gone
     */
    void sendBytes(byte[] bytes) throws IOException;

    /**
     * Drops the text received after the last complete line: once a line has gone quiet after a
     * block cut short, its tail is stale and must not start the next answer.
     *
     * @return the text dropped, empty when there was none
     */
    String discardUnfinished();

    /** @return text received after the last complete line, empty when there is none */
    String unfinishedLine();

    /** Closes the link; closing twice does nothing. */
    @Override
    void close();
}
