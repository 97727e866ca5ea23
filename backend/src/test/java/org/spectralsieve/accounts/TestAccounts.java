package org.spectralsieve.accounts;

import java.util.concurrent.atomic.AtomicInteger;

/** Invented accounts for the server-mode tests, each with a fresh name so tests never share one. */
final class TestAccounts {

    static final String PASSWORD = "larkspur-lane-bench-7";
    private static final AtomicInteger SERIAL = new AtomicInteger();

    private TestAccounts() {
    }

    static Account create(AccountAdministration administration, String name, Role role) {
        return administration.createAccount(name + "-" + SERIAL.incrementAndGet(), role, PASSWORD);
    }

    static String token(AccountAdministration administration, Account owner) {
        return administration.createToken(owner, "fernhollow bench script").secret();
    }
}
