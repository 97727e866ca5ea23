package org.spectralsieve.api;

/** A request parameter the user got wrong; answered as a 400 problem detail that names it. */
class BadParameterException extends RuntimeException {

    private final String parameter;

    BadParameterException(String parameter, String message) {
        super("parameter '" + parameter + "': " + message);
        this.parameter = parameter;
    }

    String parameter() {
        return parameter;
    }
}
