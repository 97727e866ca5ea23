package org.spectralsieve.cli;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.List;

/**
 * One run of the command line in this process, as a user's shell would see it: the exit code and what was printed
 * to standard output and standard error. Shared by the command tests so each says only what it runs and expects.
 */
record CliRun(int exitCode, String out, String err) {

    /** Runs {@code args} exactly as given. */
    static CliRun of(String... args) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        ByteArrayOutputStream err = new ByteArrayOutputStream();
        int code = SieveCli.run(args, new PrintStream(out, true, StandardCharsets.UTF_8),
                new PrintStream(err, true, StandardCharsets.UTF_8));
        return new CliRun(code, out.toString(StandardCharsets.UTF_8), err.toString(StandardCharsets.UTF_8));
    }

    /** Runs {@code args} against the library at {@code dbUrl}, named last as {@code --db-url}. */
    static CliRun against(String dbUrl, String... args) {
        String[] all = Arrays.copyOf(args, args.length + 2);
        all[args.length] = "--db-url";
        all[args.length + 1] = dbUrl;
        return of(all);
    }

    List<String> outLines() {
        return out.lines().toList();
    }
}
