package org.polebench.capture;

import java.io.IOException;

/**
 * The port or connection vanished: a USB adapter pulled out, an instrument switched off, the
 * far end of a socket or pseudo-terminal closed. What was received before is not lost.
 */
public final class PortLostException extends IOException {
    public PortLostException(String message) {
        super(message);
    }
}
