package dev.fixmod.verify.cli;

import java.io.PrintWriter;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
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
                LossCommand.class,
                CompareCommand.class,
                DemoCommand.class,
                DemapCommand.class,
                VectorsCommand.class,
                BenchCommand.class,
        },
        footer = {"", "Examples:",
                "  fixmod constellation nr:qam64",
                "  fixmod vectors generate spec.json -o vectors/my-set",
                "  fixmod compare vectors/my-set --port llr --dut llr_dump.hex",
                "  fixmod help compare",
                "",
                "Exit status: 0 success, 1 mismatches found, 2 bad input or usage.",
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
        // Colour only on a terminal: AUTO turns ANSI codes off when stdout is a pipe, a file or a test's writer.
        cl.setColorScheme(CommandLine.Help.defaultColorScheme(CommandLine.Help.Ansi.AUTO));
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            String who = "fixmod" + (qualifiedName(commandLine).isEmpty() ? "" : " " + qualifiedName(commandLine));
            if (ex instanceof UsageException || ex instanceof IllegalArgumentException) {
                return fail(commandLine, who + ": " + ex.getMessage(), ExitStatus.USAGE);
            }
            if (ex instanceof java.io.IOException || ex instanceof java.io.UncheckedIOException) {
                Throwable io = ex instanceof java.io.UncheckedIOException ? ex.getCause() : ex;
                return fail(commandLine, who + ": cannot read or write " + describe(io), ExitStatus.USAGE);
            }
            return fail(commandLine, who + ": internal error (please report): " + ex, ExitStatus.INTERNAL);
        });
        cl.setParameterExceptionHandler((ex, args) -> {
            CommandLine c = ex.getCommandLine();
            String name = qualifiedName(c);
            String message = ex.getMessage();
            // A mistyped option also leaves its command's required parameters unfilled; name the cause, not the effect.
            if (!(ex instanceof CommandLine.UnmatchedArgumentException) && !c.getUnmatchedArguments().isEmpty()) {
                message = new CommandLine.UnmatchedArgumentException(c, c.getUnmatchedArguments()).getMessage();
            }
            return fail(c, "fixmod" + (name.isEmpty() ? "" : " " + name) + ": " + message
                    + " (see 'fixmod" + (name.isEmpty() ? "" : " " + name) + " --help')", ExitStatus.USAGE);
        });
        return cl;
    }

    /** Quoted input longer than this is abbreviated in a message, so that one line stays readable. */
    private static final int MAX_QUOTED = 60;
    /** The longest message printed; hostile input must not turn one line into a megabyte. */
    private static final int MAX_MESSAGE = 1000;
    private static final Pattern LONG_QUOTE = Pattern.compile("'([^'\\n]{" + MAX_QUOTED + "})([^'\\n]+)'");

    /** One line of bounded length: newlines folded, long quoted input abbreviated with its length. */
    static String oneLine(String message) {
        Matcher m = LONG_QUOTE.matcher(message);
        StringBuilder sb = new StringBuilder();
        while (m.find()) {
            int length = m.group(1).length() + m.group(2).length();
            m.appendReplacement(sb, Matcher.quoteReplacement("'" + m.group(1) + "...' (" + length + " characters)"));
        }
        m.appendTail(sb);
        String line = sb.toString().replaceAll("\\s*\\R\\s*", " ").strip();
        return line.length() <= MAX_MESSAGE ? line : line.substring(0, MAX_MESSAGE - 3) + "...";
    }

    private static int fail(CommandLine c, String message, int status) {
        c.getErr().println(oneLine(message));
        c.getErr().flush();
        return status;
    }

    /** A file-system failure in words: which file and what went wrong, without the exception's class name. */
    private static String describe(Throwable io) {
        if (io instanceof java.nio.file.NoSuchFileException e) {
            return e.getFile() + ": no such file";
        }
        if (io instanceof java.nio.file.AccessDeniedException e) {
            return e.getFile() + ": permission denied";
        }
        if (io instanceof java.nio.file.FileAlreadyExistsException e) {
            return e.getFile() + ": already exists";
        }
        return String.valueOf(io.getMessage());
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
