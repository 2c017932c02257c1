package dev.fixmod.verify.cli;

import picocli.CommandLine;

/** The tool version shown by {@code --version} and written into every manifest and report. */
public final class Version implements CommandLine.IVersionProvider {
    /** The tool version; keep in step with the Maven project version. */
    public static final String TOOL_VERSION = "0.1.0";

    @Override
    public String[] getVersion() {
        return new String[] {"fixmod " + TOOL_VERSION, "Java " + System.getProperty("java.version")};
    }
}
