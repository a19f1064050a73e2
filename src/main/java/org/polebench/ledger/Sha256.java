package org.polebench.ledger;

import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** The SHA-256 digest (FIPS 180-4) of a file's bytes, as lower-case hex: a test's identity in the ledger. */
final class Sha256 {
    private Sha256() {
    }

    static String of(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            // every Java platform must provide SHA-256 (java.security.MessageDigest's contract)
            throw new IllegalStateException(e);
        }
    }
}
