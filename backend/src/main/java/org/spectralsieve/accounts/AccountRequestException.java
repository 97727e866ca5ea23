package org.spectralsieve.accounts;

/**
 * A request about accounts or tokens that cannot be carried out as asked; answered as a problem detail naming
 * the field (or the path's id) and the status given.
 */
public class AccountRequestException extends RuntimeException {

    private final String field;
    private final int status;

    public AccountRequestException(int status, String field, String message) {
        super(message);
        this.field = field;
        this.status = status;
    }

    public String field() {
        return field;
    }

    public int status() {
        return status;
    }
}
