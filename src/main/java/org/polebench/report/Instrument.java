package org.polebench.report;

import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * One instrument used for the test, as the report identifies it (ISO/IEC 17025:2017 7.8.2.1 and
 * 6.4.13: the equipment's identity and its calibration status).
 *
 * @param identity       maker and model, or the laboratory's own asset name; never blank
 * @param serial         its serial number; empty when not given
 * @param calibrationDue the date its calibration falls due; empty when not given
 */
public record Instrument(String identity, Optional<String> serial, Optional<LocalDate> calibrationDue) {
    public Instrument {
        if (identity.isBlank()) {
            throw new IllegalArgumentException("an instrument needs an identity");
        }
    }

    /**
     * The instruments a sweep file's {@code instrument:} line names, as a capture or a serial log
     * recorded their {@code *IDN?} answers: one answer, or {@code name: answer} parts joined by
     * "; ". An answer of four comma-separated fields (IEEE Std 488.2-1992, 10.14: maker, model,
     * serial number, firmware) gives the identity "maker model" and the serial number, unless that
     * field is 0 ("not available" in the standard); any other text is the identity as written.
     * No calibration date: a sweep file never records one. A part that says "(no instrument)"
     * (polebench's own board synthesizer writes that) names no equipment and is left out.
     *
     * @param line the sweep's instrument line; blank for none
     */
    public static List<Instrument> ofSweepIdentity(String line) {
        List<Instrument> list = new ArrayList<>();
        for (String part : line.split("; ")) {
            String answer = part.strip();
            int colon = answer.indexOf(": ");
            int comma = answer.indexOf(',');
            if (colon > 0 && (comma < 0 || colon < comma)) {
                answer = answer.substring(colon + 2).strip();   // "gen: ACME,…" names the link first
            }
            if (answer.isEmpty() || answer.endsWith("(no instrument)")) {
                continue;
            }
            String[] fields = answer.split(",", -1);
            if (fields.length == 4 && !fields[0].isBlank() && !fields[1].isBlank()) {
                String serial = fields[2].strip();
                list.add(new Instrument(fields[0].strip() + " " + fields[1].strip(),
                        serial.isEmpty() || serial.equals("0") ? Optional.empty() : Optional.of(serial),
                        Optional.empty()));
            } else {
                list.add(new Instrument(answer, Optional.empty(), Optional.empty()));
            }
        }
        return list;
    }
}
