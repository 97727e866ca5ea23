package org.spectralsieve.cli;

import java.util.List;

/** A command that cannot finish: the lines to show on stderr and the exit code to leave with. */
final class CliFailure extends RuntimeException {

    private final List<String> lines;
    private final int exitCode;

    CliFailure(int exitCode, List<String> lines) {
        super(String.join(System.lineSeparator(), lines));
        if (lines.isEmpty()) {
            throw new IllegalArgumentException("a failure needs at least one line to show");
        }
        this.lines = List.copyOf(lines);
        this.exitCode = exitCode;
    }

    CliFailure(int exitCode, String message) {
        this(exitCode, List.of(message));
    }

    List<String> lines() {
        return lines;
    }

    int exitCode() {
        return exitCode;
    }
}
