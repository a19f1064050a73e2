package org.polebench.cli;

import java.io.PrintWriter;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.polebench.InputProblem;
import org.polebench.profile.InstrumentProfile;
import org.polebench.profile.SerialProfile;
import org.polebench.profile.TableProfile;
import org.polebench.profile.WaveformProfile;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Spec;

/** {@code polebench profiles}: lists the instrument profiles with one line each. */
@Command(name = "profiles", mixinStandardHelpOptions = true,
        description = "Lists the instrument profiles: the shipped ones and any in ./instrument-profiles.")
public final class ProfilesCommand implements Callable<Integer> {
    @Spec
    CommandSpec spec;

    @Override
    public Integer call() throws InputProblem {
        PrintWriter out = spec.commandLine().getOut();
        out.printf(Locale.ROOT, "%-26s %-7s %s%n", "auto", "table",
                "sniff the layout from the header's words (the default)");
        for (InstrumentProfile profile : SweepLayoutOption.profiles().profiles()) {
            out.printf(Locale.ROOT, "%-26s %-7s %s%n", profile.name(), kind(profile), profile.description());
        }
        out.flush();
        return ExitCodes.OK;
    }

    /** @return the listing's word for the profile's kind */
    private static String kind(InstrumentProfile profile) {
        return profile.match(new InstrumentProfile.Cases<String>() {
            @Override
            public String table(TableProfile table) {
                return "table";
            }

            @Override
            public String serial(SerialProfile serial) {
                return "serial";
            }

            @Override
            public String waveform(WaveformProfile waveform) {
                return "waveform";
            }
        });
    }
}
