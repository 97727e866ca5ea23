package org.spectralsieve.ingest;

import java.util.OptionalDouble;
import org.spectralsieve.states.Exposure;
import org.spectralsieve.states.MaterialState;
import org.spectralsieve.states.Printing;
import org.spectralsieve.states.StateKind;

/**
 * The state of an imported state curve as a form or the command line gives it, field by field as text, checked into a
 * {@link MaterialState}; every mistake is an {@link ImportRequestException} naming the field to change (the API's and
 * the command line's names: {@code state}, {@code hours}, {@code source}, {@code doseJPerCm2}, {@code doseNm},
 * {@code inkLoadPercent}, {@code statedDensity}).
 */
public final class StateFields {

    /** The longest exposure source kept (the column's width). */
    public static final int MAX_SOURCE = 200;

    private StateFields() {
    }

    /** @throws ImportRequestException naming the first field that is missing, wrong or does not belong to the state */
    public static MaterialState parse(String state, String hours, String source, String doseJPerCm2, String doseNm,
                                      String inkLoadPercent, String statedDensity) {
        if (OptionText.blank(state)) {
            throw new ImportRequestException("state", "say which state the curve shows: aged or printed");
        }
        StateKind kind = StateKind.fromWord(state);
        if (kind == null) {
            throw new ImportRequestException("state", "'" + state.strip() + "' is not a state: aged or printed");
        }
        if (kind == StateKind.AS_SUPPLIED) {
            throw new ImportRequestException("state", "the sample's own curve is its as-supplied state (new, or a film's"
                    + " clear base); import that as a sample, and its aged or printed curves as states of it");
        }
        OptionalDouble h = OptionText.number("hours", hours);
        OptionalDouble dose = OptionText.number("doseJPerCm2", doseJPerCm2);
        OptionalDouble nm = OptionText.number("doseNm", doseNm);
        String src = OptionText.line("source", source, MAX_SOURCE);
        OptionalDouble ink = OptionText.number("inkLoadPercent", inkLoadPercent);
        OptionalDouble density = OptionText.number("statedDensity", statedDensity);
        if (kind == StateKind.AGED) {
            notForThisState("inkLoadPercent", ink, "aged");
            notForThisState("statedDensity", density, "aged");
            return MaterialState.aged(exposure(h, src, dose, nm));
        }
        notForThisState("hours", h, "printed");
        notForThisState("doseJPerCm2", dose, "printed");
        notForThisState("doseNm", nm, "printed");
        if (src != null) {
            throw new ImportRequestException("source", "a source belongs to an aged curve's hours, not to a printed one");
        }
        if (ink.isEmpty() && density.isEmpty()) {
            throw new ImportRequestException("inkLoadPercent", "a printed curve states its ink load in % (inkLoadPercent),"
                    + " its density (statedDensity), or both");
        }
        if (ink.isPresent() && !(ink.getAsDouble() > 0 && ink.getAsDouble() <= Printing.MAX_INK_LOAD_PERCENT)) {
            throw new ImportRequestException("inkLoadPercent", "must lie above 0 and at most "
                    + (long) Printing.MAX_INK_LOAD_PERCENT + " %, got " + inkLoadPercent.strip());
        }
        if (density.isPresent() && !(density.getAsDouble() > 0 && density.getAsDouble() <= Printing.MAX_STATED_DENSITY)) {
            throw new ImportRequestException("statedDensity", "must lie above 0 and at most "
                    + (long) Printing.MAX_STATED_DENSITY + ", got " + statedDensity.strip());
        }
        return MaterialState.printed(new Printing(ink.orElse(Double.NaN), density.orElse(Double.NaN)));
    }

    private static Exposure exposure(OptionalDouble h, String source, OptionalDouble dose, OptionalDouble nm) {
        if (h.isPresent() && (dose.isPresent() || nm.isPresent())) {
            throw new ImportRequestException(dose.isPresent() ? "doseJPerCm2" : "doseNm", "an aged curve states hours"
                    + " under a source or a dose in J/cm² at a wavelength, not both");
        }
        if (h.isPresent()) {
            if (!(h.getAsDouble() > 0 && h.getAsDouble() <= Exposure.MAX_HOURS)) {
                throw new ImportRequestException("hours", "must lie above 0 and at most " + (long) Exposure.MAX_HOURS
                        + ", got " + h.getAsDouble());
            }
            return Exposure.hours(h.getAsDouble(), source);
        }
        if (dose.isEmpty()) {
            throw new ImportRequestException(nm.isPresent() ? "doseJPerCm2" : "hours", "an aged curve states its exposure:"
                    + " hours (with the source's name in source) or doseJPerCm2 with doseNm");
        }
        if (source != null) {
            throw new ImportRequestException("source", "a source's name goes with hours; a dose is stated at a"
                    + " wavelength (doseNm)");
        }
        if (!(dose.getAsDouble() > 0 && dose.getAsDouble() <= Exposure.MAX_DOSE_J_PER_CM2)) {
            throw new ImportRequestException("doseJPerCm2", "must lie above 0 and at most "
                    + (long) Exposure.MAX_DOSE_J_PER_CM2 + " J/cm², got " + dose.getAsDouble());
        }
        if (nm.isEmpty()) {
            throw new ImportRequestException("doseNm", "a dose needs the wavelength it was given at, in nm");
        }
        if (!(nm.getAsDouble() >= 100 && nm.getAsDouble() <= 3000)) {
            throw new ImportRequestException("doseNm", "must lie from 100 to 3000 nm, got " + nm.getAsDouble());
        }
        return Exposure.dose(dose.getAsDouble(), nm.getAsDouble());
    }

    private static void notForThisState(String field, OptionalDouble v, String state) {
        if (v.isPresent()) {
            throw new ImportRequestException(field, "does not belong to a" + ("aged".equals(state) ? "n " : " ") + state
                    + " curve");
        }
    }
}
