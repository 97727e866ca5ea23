/**
 * Material states: the conditions a sample's curves were measured in, as plain values the library stores and
 * the requirement evaluator reads (docs/material-states.md).
 *
 * <ul>
 *   <li>{@link StateKind}: as supplied (new, or a film's clear unprinted base), aged (after an
 *       {@link Exposure}), printed (a film's printed black at a stated {@link Printing}).</li>
 *   <li>{@link StateCurve}: one extra curve of a sample in a state other than as supplied; the sample's own curve is
 *       always its as-supplied state.</li>
 * </ul>
 *
 * <p>A state curve is judged as measured, never rescaled: ageing is not uniform through the depth (a yellowed
 * core, a surface that takes the dose first) and ink is a layer on a film, so Beer–Lambert does not carry either to
 * another thickness. Plain Java, no framework (CoreIsFrameworkFreeTest).
 */
package org.spectralsieve.states;
