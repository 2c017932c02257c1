package dev.fixmod.verify.cli;

import dev.fixmod.verify.demo.Demo;
import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

/** {@code fixmod demo}: the built-in fictional scenario end to end. */
@Command(name = "demo", mixinStandardHelpOptions = true,
        description = {"Runs the built-in scenario end to end (a fictional 64-QAM link moving its demapper to a small"
                + " FPGA): writes its specifications, a golden vector set, the quantization-loss report with the"
                + " recommended word lengths, and the comparison of a bundled cycle model of the device (and of a"
                + " deliberately faulty build) against the vectors; then prints a summary with the paths to open.",
                "An existing folder is replaced only if it holds a previous demo (or is empty)."},
        footer = {"", "Examples:",
                "  fixmod demo",
                "  fixmod demo -o /tmp/fixmod-demo --threads 1",
                "",
                "Exit status: 0 success (the faulty build's disagreement is expected), 2 bad usage."})
public final class DemoCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Option(names = {"-o", "--output"}, paramLabel = "DIR", defaultValue = Demo.DEFAULT_FOLDER,
            description = "The demo folder (default: ${DEFAULT-VALUE} in the working folder).")
    Path output;

    /** 0 stands for "all cores", as in every other command's --threads. */
    @Option(names = "--threads", paramLabel = "N", defaultValue = "0", description = "Worker threads (default:"
            + " all cores). The outputs do not depend on it.")
    int threads;

    @Override
    public Integer call() throws IOException {
        if (threads < 0 || threads > 1024) {
            throw new UsageException("--threads must be 0 (all cores) or 1 to 1024, got " + threads);
        }
        int n = threads == 0 ? Runtime.getRuntime().availableProcessors() : threads;
        PrintWriter out = spec.commandLine().getOut();
        out.println("running the demo scenario into " + output + " (about half a minute)...");
        out.flush();
        Demo.Result result = Demo.run(output, n);
        String folder = output.toString();
        out.print(Demo.summary(result, folder.endsWith("/") ? folder : folder + "/"));
        out.flush();
        return ExitStatus.OK;
    }
}
