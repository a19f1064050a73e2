package org.polebench.cli;

import picocli.CommandLine;

/** Reads the version from the jar manifest; a build from the IDE says "development build". */
public final class VersionProvider implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        String version = Main.class.getPackage().getImplementationVersion();
        return new String[] {"polebench " + (version == null ? "development build" : version)};
    }
}
