package org.spectralsieve.optics;

/**
 * Fresnel's reflectances from air written in the textbook's other form (Hecht, Optics, eqs. 4.42–4.43:
 * R_s = sin²(θi − θt)/sin²(θi + θt), R_p = tan²(θi − θt)/tan²(θi + θt)), not the code's form, so the tests that check
 * light at an angle compare two different routes to the same numbers.
 */
final class FresnelByAngles {

    private FresnelByAngles() {
    }

    static double rs(double n, double theta) {
        double t = Math.asin(Math.sin(theta) / n);
        double a = Math.sin(theta - t) / Math.sin(theta + t);
        return a * a;
    }

    static double rp(double n, double theta) {
        double t = Math.asin(Math.sin(theta) / n);
        double a = Math.tan(theta - t) / Math.tan(theta + t);
        return a * a;
    }

    /** cos θt by Snell's law. */
    static double cosRefracted(double n, double theta) {
        double s = Math.sin(theta) / n;
        return Math.sqrt(1 - s * s);
    }
}
