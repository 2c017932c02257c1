package dev.fixmod.verify.cli;

import java.io.PrintWriter;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The {@code fixmod} command: dispatches to one subcommand per job. */
@Command(name = "fixmod",
        mixinStandardHelpOptions = true,
        versionProvider = Version.class,
        description = "Bit-exact reference kernel for digital modulation, with golden vectors, device comparison"
                + " and quantization-loss reports.",
        subcommands = {
                CommandLine.HelpCommand.class,
                ConstellationCommand.class,
                DemapCommand.class
        },
        footer = {"", "Exit status: 0 success, 1 mismatches found, 2 bad input or usage.",
                "Results are engineering models, not conformance certification; the governing standard's text decides."})
public final class FixmodCommand implements Runnable {

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /** Builds the command line with fixmod's error discipline. */
    public static CommandLine commandLine(PrintWriter out, PrintWriter err) {
        CommandLine cl = new CommandLine(new FixmodCommand());
        cl.setOut(out);
        cl.setErr(err);
        cl.setCaseInsensitiveEnumValuesAllowed(true);
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            Throwable cause = ex;
            if (cause instanceof UsageException || cause instanceof IllegalArgumentException) {
                commandLine.getErr().println("fixmod " + commandLine.getCommandName() + ": " + cause.getMessage());
                commandLine.getErr().flush();
                return ExitStatus.USAGE;
            }
            commandLine.getErr().println("fixmod " + commandLine.getCommandName() + ": internal error: " + cause);
            commandLine.getErr().flush();
            return 3;
        });
        cl.setParameterExceptionHandler((ex, args) -> {
            CommandLine c = ex.getCommandLine();
            c.getErr().println("fixmod " + c.getCommandName() + ": " + ex.getMessage());
            c.getErr().println("Try 'fixmod " + qualifiedName(c) + " --help'.");
            c.getErr().flush();
            return ExitStatus.USAGE;
        });
        return cl;
    }

    private static String qualifiedName(CommandLine c) {
        String name = c.getCommandSpec().qualifiedName(" ");
        return name.startsWith("fixmod ") ? name.substring(7) : name.equals("fixmod") ? "" : name;
    }

    /** Runs fixmod with the given arguments on the standard streams and returns the exit status. */
    public static int execute(String... args) {
        PrintWriter out = new PrintWriter(System.out, true);
        PrintWriter err = new PrintWriter(System.err, true);
        return commandLine(out, err).execute(args);
    }

    public static void main(String[] args) {
        System.exit(execute(args));
    }
}
