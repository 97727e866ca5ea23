package org.spectralsieve.cli;

import java.io.PrintStream;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Set;
import org.spectralsieve.SpectralSieveApplication;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/** The entry of the command line: parses the arguments, runs one command, returns its exit code. */
@Command(name = "spectral-sieve", mixinStandardHelpOptions = true, scope = CommandLine.ScopeType.INHERIT,
        versionProvider = SieveCli.Version.class,
        description = "Search the transmittance library by requirement, list its materials, export a curve, compute a"
                + " sample's weighted figures, import files and emitter or response spectra, retire, restore and correct"
                + " them, back the library up to one archive and load it into an empty library, and create server-mode accounts.",
        subcommands = {SearchCommand.class, ExportCommand.class, MaterialsCommand.class, ImportCommand.class, ImportStateCommand.class, PreviewCommand.class,
                ImportSpectrumCommand.class, FiguresCommand.class, SimilarCommand.class,
                RetireCommand.class, RestoreCommand.class, CorrectCommand.class, RevisionsCommand.class,
                BackupCommand.class, RestoreBackupCommand.class, AddAccountCommand.class, PresetsCommand.class,
                CommandLine.HelpCommand.class},
        exitCodeListHeading = "%nExit codes:%n",
        exitCodeList = {
                "0:done",
                "1:understood but cannot be carried out (no such sample, database in use, a refused import, ...)",
                "2:the command line cannot be read (bad option, requirement that does not parse)"})
public final class SieveCli {

    public static final int OK = 0;
    public static final int FAILED = 1;
    public static final int USAGE = 2;

    /** First arguments, besides a command's name, that mean "run the command line" rather than "start the web service". */
    private static final Set<String> HELP_WORDS = Set.of("help", "--help", "-h", "--version", "-V");

    private SieveCli() {
    }

    /**
     * True when the first argument names a command (or asks for help): taken from the registered commands
     * themselves, so that a new command can never start the web service instead by being left off a list.
     */
    public static boolean handles(String[] args) {
        return args.length > 0 && (HELP_WORDS.contains(args[0]) || declaredCommandNames().contains(args[0]));
    }

    /**
     * The subcommands' names read from the annotations alone: what {@link #commandNames()} gives, without
     * building picocli's whole model of every command and option, which {@link #run} builds anyway; deciding
     * "command or server" was paying for that model twice on every call (docs/command-line-start-up.md).
     */
    static Set<String> declaredCommandNames() {
        Set<String> names = new java.util.HashSet<>();
        for (Class<?> sub : SieveCli.class.getAnnotation(Command.class).subcommands()) {
            Command declared = sub.getAnnotation(Command.class);
            names.add(declared.name());
            names.addAll(List.of(declared.aliases()));
        }
        return names;
    }

    static Set<String> commandNames() {
        return new CommandLine(new SieveCli()).getSubcommands().keySet();
    }

    /** Runs one command in this process: what it prints goes to {@code out} and {@code err}. */
    public static int run(String[] args, PrintStream out, PrintStream err) {
        PrintWriter outWriter = new PrintWriter(out, true, StandardCharsets.UTF_8);
        PrintWriter errWriter = new PrintWriter(err, true, StandardCharsets.UTF_8);
        CommandLine cli = new CommandLine(new SieveCli())
                .setOut(outWriter)
                .setErr(errWriter)
                .setExecutionExceptionHandler(SieveCli::reportFailure);
        try {
            return cli.execute(args);
        } finally {
            outWriter.flush();
            errWriter.flush();
        }
    }

    /** A command's failure is a message for the user, not a stack trace. */
    private static int reportFailure(Exception e, CommandLine command, CommandLine.ParseResult parsed) {
        PrintWriter err = command.getErr();
        if (e instanceof CliFailure failure) {
            failure.lines().forEach(err::println);
            return failure.exitCode();
        }
        err.println("spectral-sieve " + command.getCommandName() + ": failed: " + LibraryContext.rootMessage(e));
        return FAILED;
    }

    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            String version = SpectralSieveApplication.class.getPackage().getImplementationVersion();
            return new String[] {"Spectral Sieve " + (version == null ? "(development build)" : version)};
        }
    }
}
