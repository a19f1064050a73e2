package org.polebench.cli;

import picocli.CommandLine;

/** Reads the version from the jar manifest; a build from the IDE says "development build". */
public final class VersionProvider implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        return new String[] {versionLine()};
    }

    /** @return "polebench" and the version the jar's manifest names */
    static String versionLine() {
        String version = Main.class.getPackage().getImplementationVersion();
        return "polebench " + (version == null ? "development build" : version);
    }
}
