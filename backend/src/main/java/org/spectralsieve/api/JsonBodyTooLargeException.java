package org.spectralsieve.api;

import java.io.IOException;

/** Thrown by the body stream once a JSON body sent without a length runs past the cap. */
final class JsonBodyTooLargeException extends IOException {

    JsonBodyTooLargeException(long limit) {
        super("the request body has more than " + limit + " bytes; at most " + limit + " are read");
    }
}
