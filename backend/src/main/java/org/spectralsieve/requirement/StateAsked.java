package org.spectralsieve.requirement;

import java.util.Objects;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.StateKind;

/**
 * Which of a sample's curves a clause reads: as supplied (the sample's own curve: new, or a film's clear base),
 * printed black, or aged after an exposure. For {@link StateKind#AGED}, {@code amount} is hours when
 * {@code inHours}, else a dose in J/cm² at {@code doseNm}; NaN for the other kinds.
 */
public record StateAsked(StateKind kind, double amount, boolean inHours, double doseNm) {

    public static final StateAsked AS_SUPPLIED = new StateAsked(StateKind.AS_SUPPLIED, Double.NaN, false, Double.NaN);
    public static final StateAsked PRINTED = new StateAsked(StateKind.PRINTED, Double.NaN, false, Double.NaN);

    public StateAsked {
        Objects.requireNonNull(kind, "kind");
        if (kind == StateKind.AGED) {
            // the same limits a stored exposure has: an asked exposure no curve could state is a slip
            if (inHours) {
                Exposure.hours(amount, "");
            } else {
                Exposure.dose(amount, doseNm);
            }
        } else if (!Double.isNaN(amount) || !Double.isNaN(doseNm) || inHours) {
            throw new IllegalArgumentException("only an aged state has an exposure");
        }
    }

    public static StateAsked afterHours(double hours) {
        return new StateAsked(StateKind.AGED, hours, true, Double.NaN);
    }

    public static StateAsked afterDose(double jPerCm2, double nm) {
        return new StateAsked(StateKind.AGED, jPerCm2, false, nm);
    }

    /** Whether a stored exposure is on the scale this asks in (hours with hours, a dose at the same wavelength). */
    boolean sameScale(Exposure exposure) {
        return inHours ? exposure.inHours() : !exposure.inHours() && exposure.doseNm() == doseNm;
    }

    /** The words the language uses: "as supplied", "printed black", "after 1000 h", "after 50 J/cm² at 365 nm". */
    String words() {
        return switch (kind) {
            case AS_SUPPLIED -> "as supplied";
            case PRINTED -> "printed black";
            case AGED -> inHours ? "after " + Wording.plain(amount) + " h"
                    : "after " + Wording.plain(amount) + " J/cm² at " + Wording.nm(doseNm);
        };
    }
}
