package org.spectralsieve.access;

import java.net.InetAddress;
import java.net.UnknownHostException;

/**
 * Where the web server listens, from {@code server.address} ({@code SIEVE_ADDRESS}): the loopback
 * interface by default; any other address opens the library to whoever can reach the machine.
 *
 * @param setting as configured; empty means every interface (the servlet container's default)
 */
record ListeningAddress(String setting) {

    ListeningAddress {
        setting = setting == null ? "" : setting.strip();
    }

    /** True for 127.0.0.1, ::1, localhost: only programs on this machine can connect. */
    boolean isLoopback() {
        if (setting.isEmpty()) {
            return false;
        }
        try {
            return InetAddress.getByName(setting).isLoopbackAddress();
        } catch (UnknownHostException e) {
            return false; // the server itself will fail to bind; nothing to protect here
        }
    }

    String describe() {
        return setting.isEmpty() || setting.equals("0.0.0.0") || setting.equals("::")
                ? "every network interface" : setting;
    }
}
