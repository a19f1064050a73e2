package org.polebench.report;

import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.Locale;

/**
 * What makes one issue of a report unique: its id and its date of issue (ISO/IEC 17025:2017
 * 7.8.2.1 b and h). Everything else in a report follows from the result it renders.
 *
 * @param reportId printed on every page, such as {@code PB-20260314-3F9A0C12}
 * @param issued   the date of issue, to the second, UTC
 */
public record ReportStamp(String reportId, Instant issued) {
    private static final DateTimeFormatter DAY = DateTimeFormatter.ofPattern("yyyyMMdd", Locale.ROOT)
            .withZone(ZoneOffset.UTC);

    public ReportStamp {
        if (reportId == null || reportId.isBlank()) {
            throw new IllegalArgumentException("a report needs an id");
        }
        issued = issued.truncatedTo(ChronoUnit.SECONDS);
    }

    /**
     * A fresh stamp: the id is "PB-", the issue day, and the first 8 hex digits of SHA-256 over
     * the result's text and the issue instant to the nanosecond, so that two issues of one result
     * (or two results issued at once) get different ids.
     */
    public static ReportStamp issue(String resultText, Instant now) {
        String digest = FileDigest.sha256((resultText + "\n" + now.toString() + "\n" + now.getNano())
                .getBytes(java.nio.charset.StandardCharsets.UTF_8));
        return new ReportStamp("PB-" + DAY.format(now) + "-" + digest.substring(0, 8).toUpperCase(Locale.ROOT), now);
    }

    /** @return the date of issue as ISO-8601 UTC, such as 2026-03-14T09:30:00Z */
    public String issuedText() {
        return DateTimeFormatter.ISO_INSTANT.format(issued);
    }
}
