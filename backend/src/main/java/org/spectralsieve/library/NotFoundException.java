package org.spectralsieve.library;

/** Something asked for by id does not exist; the API answers 404, never 500. */
public class NotFoundException extends RuntimeException {

    private final String what;
    private final long id;

    public NotFoundException(String what, long id) {
        super("no " + what + " with id " + id);
        this.what = what;
        this.id = id;
    }

    public String what() {
        return what;
    }

    public long id() {
        return id;
    }
}
