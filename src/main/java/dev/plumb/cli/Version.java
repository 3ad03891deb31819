package dev.plumb.cli;

import picocli.CommandLine;

/** The version string, from the jar manifest when there is one. */
public final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
        String v = Version.class.getPackage().getImplementationVersion();
        return new String[] {"plumb " + (v == null ? "0.1.0" : v), "License GPL-3.0-or-later"};
    }
}
