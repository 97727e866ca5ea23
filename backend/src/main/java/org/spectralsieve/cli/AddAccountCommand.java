package org.spectralsieve.cli;

import java.io.BufferedReader;
import java.io.Console;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.concurrent.Callable;
import org.spectralsieve.accounts.Account;
import org.spectralsieve.accounts.AccountAdministration;
import org.spectralsieve.accounts.AccountRequestException;
import org.spectralsieve.accounts.Role;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code add-account}: creates a server-mode account, the first admin above all (there is no default account
 * or password). The password never appears on the command line, where other users of the machine could read
 * it: it is typed at the console (twice) or read from standard input with {@code --password-stdin}.
 */
@Command(name = "add-account", description = "Create an account for server mode (the first admin, for one): the"
        + " password is asked for at the console, or read from standard input with --password-stdin.")
final class AddAccountCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--name", required = true, paramLabel = "NAME", description = "the account's name (letters,"
            + " digits, '.', '_', '-')")
    String name;

    @Option(names = "--role", required = true, paramLabel = "ROLE", description = "viewer, editor or admin")
    String role;

    @Option(names = "--password-stdin", description = "read the password from the first line of standard input")
    boolean passwordFromStdin;

    @Override
    public Integer call() {
        Role parsed = Role.parse(role).orElseThrow(() -> new CliFailure(SieveCli.USAGE,
                "--role: '" + role + "' is not viewer, editor or admin"));
        String password = passwordFromStdin ? readStdin() : readConsole();
        try {
            AccountAdministration.checkPassword(password); // before the library is opened: a quick refusal
        } catch (AccountRequestException e) {
            throw new CliFailure(SieveCli.FAILED, "not created: " + e.getMessage());
        }
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            Account account = context.getBean(AccountAdministration.class).createAccount(name, parsed, password);
            spec.commandLine().getOut().println("created " + account.role().label() + " account '" + account.name()
                    + "' (id " + account.id() + "); it can sign in once the server runs in server mode");
            return SieveCli.OK;
        } catch (AccountRequestException e) {
            throw new CliFailure(SieveCli.FAILED, "not created: " + e.field() + ": " + e.getMessage());
        }
    }

    private static String readStdin() {
        try {
            String line = new BufferedReader(new InputStreamReader(System.in, StandardCharsets.UTF_8)).readLine();
            if (line == null) {
                throw new CliFailure(SieveCli.FAILED, "not created: standard input held no password");
            }
            return line;
        } catch (IOException e) {
            throw new CliFailure(SieveCli.FAILED, "not created: cannot read standard input: " + e.getMessage());
        }
    }

    private static String readConsole() {
        Console console = System.console();
        if (console == null) {
            throw new CliFailure(SieveCli.USAGE, "no console to ask for the password: give it on standard input"
                    + " with --password-stdin");
        }
        char[] first = console.readPassword("Password for the new account (at least %d characters): ",
                AccountAdministration.MIN_PASSWORD_CHARS);
        char[] second = console.readPassword("The same password again: ");
        if (first == null || second == null || !Arrays.equals(first, second)) {
            throw new CliFailure(SieveCli.FAILED, "not created: the two passwords differ");
        }
        return new String(first);
    }
}
