package org.spectralsieve.api;

/**
 * A sample that has no figure at an angle (coated or laminated, diffuse or scattering): the request is well formed
 * but cannot be computed, so a 422 problem that names the parameter that asked for the angle and says why.
 */
class NotAtAngleException extends RuntimeException {

    private final String parameter;

    NotAtAngleException(String parameter, String message) {
        super(message);
        this.parameter = parameter;
    }

    String parameter() {
        return parameter;
    }
}
