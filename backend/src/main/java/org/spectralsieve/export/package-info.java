/**
 * {@link org.spectralsieve.export.SampleCurveCsv}: a sample's curve, as measured or rescaled, with its
 * metadata as the project's CSV (the importers' writer), for the HTTP download and the {@code export}
 * command. Plain Java: no framework (checked by {@code CoreIsFrameworkFreeTest}).
 */
package org.spectralsieve.export;
