package org.polebench.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.polebench.InputProblem;
import org.polebench.InputWarning;
import org.polebench.sweepfile.ImportedSweep;
import org.polebench.sweep.LowerCornerEstimate;
import org.polebench.sweep.RoughLowerCorner;
import org.polebench.sweep.Sweep;
import org.polebench.sweepfile.SweepWriter;
import org.polebench.units.EngineeringValue;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code polebench inspect SWEEP}: says what was read from a sweep file and what looks wrong with it. */
@Command(name = "inspect", mixinStandardHelpOptions = true,
        description = "Reads a sweep (a table, a serial log, or a folder of scope waveform records) and prints the number of points, the band, the "
                + "profile and column mapping used, the midband level, a rough lower -3 dB corner and every warning.")
public final class InspectCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Parameters(index = "0", arity = "1..*", paramLabel = "SWEEP", description = "the sweep file: CSV or other table, "
            + "or a serial log; or a folder or list of scope waveform records, one per frequency")
    List<Path> sweepFiles;

    @Mixin
    SweepLayoutOption layout = new SweepLayoutOption();

    @Option(names = "--json", description = "print the result as JSON")
    boolean json;

    @Option(names = "--export", paramLabel = "FILE", description = "also write the sweep as polebench's canonical CSV")
    Path export;

    @Option(names = "--force", description = "let --export replace an existing file")
    boolean force;

    @Override
    public Integer call() throws InputProblem, IOException {
        ImportedSweep imported = layout.read(sweepFiles);
        LowerCornerEstimate corner = new RoughLowerCorner().estimate(imported.sweep());
        if (export != null) {
            new SweepWriter().writeCanonical(imported.sweep(), export, force);
        }
        PrintWriter out = spec.commandLine().getOut();
        if (json) {
            new JsonOutput().printValue(asJson(imported, corner), out);
        } else {
            printText(out, imported, corner);
        }
        out.flush();
        return ExitCodes.OK;
    }

    private Map<String, Object> asJson(ImportedSweep imported, LowerCornerEstimate corner) {
        Sweep sweep = imported.sweep();
        Map<String, Object> json = new LinkedHashMap<>();
        json.put("file", sweepFiles.get(0).toString());
        if (sweepFiles.size() > 1) {
            json.put("files", sweepFiles.stream().map(Path::toString).toList());
        }
        json.put("sha256", sweep.source().sha256());
        json.put("profile", imported.profileName());
        json.put("mapping", imported.mapping());
        json.put("points", sweep.size());
        json.put("has_phase", sweep.hasPhase());
        json.put("lowest_hz", sweep.lowestHz());
        json.put("highest_hz", sweep.highestHz());
        json.put("midband_gain_db", corner.midbandGainDb());
        json.put("lower_corner_hz", corner.cornerHz().isPresent() ? corner.cornerHz().getAsDouble() : null);
        json.put("reaches_below_corner", corner.reachesBelow());
        json.put("reaches_above_corner", corner.reachesAbove());
        json.put("instrument", sweep.source().instrument());
        json.put("captured", sweep.source().captured().map(Object::toString).orElse(null));
        json.put("board", sweep.source().board().orElse(null));
        json.put("notes", sweep.source().notes());
        List<Map<String, Object>> warnings = new ArrayList<>();
        for (InputWarning warning : imported.warnings()) {
            Map<String, Object> w = new LinkedHashMap<>();
            w.put("file", warning.fileIfAny().map(Path::toString).orElse(null));
            w.put("line", warning.line());
            w.put("message", warning.message());
            warnings.add(w);
        }
        json.put("warnings", warnings);
        json.put("exported_to", export == null ? null : export.toString());
        return json;
    }

    private void printText(PrintWriter out, ImportedSweep imported, LowerCornerEstimate corner) {
        Sweep sweep = imported.sweep();
        out.println("sweep:     " + SweepLayoutOption.label(sweepFiles));
        out.println("profile:   " + imported.profileName());
        out.println("mapping:   " + imported.mapping());
        out.println("points:    " + sweep.size() + (sweep.hasPhase() ? " (gain and phase)" : " (gain only)"));
        // warnings before the figures read from the data (issue 14)
        out.println("warnings:  " + (imported.warnings().isEmpty() ? "none" : imported.warnings().size()));
        for (InputWarning warning : imported.warnings()) {
            out.println("  " + warning.describe());
        }
        out.println("band:      " + EngineeringValue.format(sweep.lowestHz(), "Hz", 4) + " to "
                + EngineeringValue.format(sweep.highestHz(), "Hz", 4));
        out.println("midband:   " + String.format(Locale.ROOT, "%.2f dB", corner.midbandGainDb())
                + " (median of the top decile of gains)");
        out.println("corner:    " + (corner.cornerHz().isPresent()
                ? EngineeringValue.format(corner.cornerHz().getAsDouble(), "Hz", 3)
                        + " (rough lower -3 dB point, interpolated from the data)"
                : "not located from these data"));
        if (!sweep.source().instrument().isEmpty()) {
            out.println("instrument: " + sweep.source().instrument());
        }
        sweep.source().captured().ifPresent(when -> out.println("captured:  " + when));
        if (export != null) {
            out.println("exported:  " + export);
        }
    }
}
