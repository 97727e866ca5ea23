package org.spectralsieve.cli;

import java.util.concurrent.Callable;
import org.spectralsieve.export.SampleCurveCsv;
import org.spectralsieve.export.SampleCurveJcamp;
import org.spectralsieve.library.NotFoundException;
import org.spectralsieve.library.NotRescalableException;
import org.spectralsieve.library.SampleCurve;
import org.spectralsieve.library.SampleCurves;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/** {@code export --sample ID}: one sample's curve, optionally rescaled, as the project's CSV on stdout. */
@Command(name = "export", description = "Write one sample's transmittance curve to stdout, rescaled to another"
        + " thickness when asked.")
final class ExportCommand implements Callable<Integer> {

    /**
     * The project's own CSV, or JCAMP-DX ({@code jdx}); an enum so picocli lists the choices and rejects
     * others, in lower case because the help lists the constants as the words to type.
     */
    enum Format { csv, jdx }

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--sample", required = true, paramLabel = "ID", description = "Sample id (see search and materials).")
    long sampleId;

    @Option(names = "--thickness-mm", paramLabel = "MM", description = "Rescale to this thickness (bulk materials only).")
    Double thicknessMm;

    @Option(names = "--format", defaultValue = "csv", paramLabel = "FORMAT",
            description = "Output format: ${COMPLETION-CANDIDATES} (default: ${DEFAULT-VALUE}).")
    Format format;

    @Override
    public Integer call() {
        if (thicknessMm != null && !(thicknessMm > 0 && thicknessMm <= SampleCurves.MAX_THICKNESS_MM)) {
            throw new ParameterException(spec.commandLine(), "--thickness-mm must be above 0 and at most "
                    + Numbers.mm(SampleCurves.MAX_THICKNESS_MM) + ", got " + thicknessMm);
        }
        String csv;
        try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
            SampleCurve curve = context.getBean(SampleCurves.class).get(sampleId, thicknessMm, null);
            csv = format == Format.jdx ? SampleCurveJcamp.write(curve) : SampleCurveCsv.write(curve);
        } catch (NotFoundException | NotRescalableException e) {
            throw new CliFailure(SieveCli.FAILED, e.getMessage());
        }
        spec.commandLine().getOut().print(csv);
        spec.commandLine().getOut().flush();
        return SieveCli.OK;
    }
}
