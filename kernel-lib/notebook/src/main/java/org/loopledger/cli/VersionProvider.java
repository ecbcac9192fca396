package org.loopledger.cli;

import picocli.CommandLine;

/** The version from the jar manifest, or the development version. */
final class VersionProvider implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        String v = Main.class.getPackage().getImplementationVersion();
        return new String[] {"loopledger " + (v == null ? "0.1.0-SNAPSHOT" : v) + " on Java " + Runtime.version()};
    }
}
