package org.spectralsieve.cli;

import java.util.List;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;
import org.spectralsieve.library.Material;
import org.spectralsieve.search.SearchService;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Spec;

/**
 * {@code materials}: the library's materials with the thicknesses they were measured at and those they are
 * made in (stated, or the assumed rule; see docs/thickness.md).
 */
@Command(name = "materials", description = "List the library's materials: id, name, class, measured thicknesses,"
        + " thicknesses made in.")
final class MaterialsCommand implements Callable<Integer> {

    /** Same bound as the HTTP list: a longer text is a paste accident, not a search. */
    static final int MAX_TEXT = 200;

    @Spec
    CommandSpec spec;

    @Mixin
    DatabaseOption database;

    @Option(names = "--class", paramLabel = "CLASS", description = "Only this class, e.g. \"plastic sheet\".")
    String materialClass;

    @Option(names = "--q", paramLabel = "TEXT", description = "Only materials whose name, description or tags hold TEXT.")
    String text;

    @Override
    public Integer call() {
        if (text != null && text.length() > MAX_TEXT) {
            throw new ParameterException(spec.commandLine(), "--q: at most " + MAX_TEXT + " characters, got " + text.length());
        }
        List<Material> materials;
        try (LibraryServices library = LibraryContext.open(database.url)) {
            materials = library.repository().findMaterials(materialClass, text);
        }
        TextTable table = new TextTable(List.of(">id", "name", "class", "measured mm", "made in"));
        for (Material m : materials) {
            String thicknesses = m.samples().stream().map(s -> Numbers.mm(s.thicknessMm())).collect(Collectors.joining(", "));
            table.add(List.of(String.valueOf(m.id()), m.name(), m.materialClass().label(), thicknesses,
                    SearchService.made(m).summary()));
        }
        table.print(spec.commandLine().getOut());
        return SieveCli.OK;
    }
}
