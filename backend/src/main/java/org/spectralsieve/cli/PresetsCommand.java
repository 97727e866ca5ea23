package org.spectralsieve.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;
import java.util.concurrent.Callable;
import org.spectralsieve.library.FieldException;
import org.spectralsieve.presets.PresetCaller;
import org.spectralsieve.presets.PresetFile;
import org.spectralsieve.presets.PresetLibrary;
import org.spectralsieve.presets.PresetNameTakenException;
import org.spectralsieve.presets.PresetNotFoundException;
import org.spectralsieve.presets.PresetTextException;
import org.spectralsieve.presets.PresetView;
import org.springframework.context.ConfigurableApplicationContext;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * {@code presets}: the built-in requirement presets and the library's saved ones (docs/presets.md). The command line
 * acts as the embedded tool's single user: it sees and changes the presets that belong to everyone (owner NULL).
 */
@Command(name = "presets", description = "Requirement presets: list them, show one, write them to a file or read"
        + " them from one. Run one with: search --preset NAME.",
        subcommands = {PresetsCommand.ListPresets.class, PresetsCommand.Show.class, PresetsCommand.Export.class,
                PresetsCommand.Import.class})
final class PresetsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Override
    public Integer call() {
        spec.commandLine().usage(spec.commandLine().getOut());
        return SieveCli.USAGE;
    }

    private static final JsonMapper JSON = JsonMapper.builder().build();
    /** A presets file larger than this is not a presets file (the API's JSON bodies stop at 64 KiB too). */
    static final long MAX_FILE_BYTES = 64 * 1024;

    @Command(name = "list", description = "The presets: built in, then saved; name, origin, title.")
    static final class ListPresets implements Callable<Integer> {
        @Spec
        CommandSpec spec;
        @Mixin
        DatabaseOption database;

        @Override
        public Integer call() {
            List<PresetView> all;
            try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
                all = context.getBean(PresetLibrary.class).list(PresetCaller.LOCAL);
            }
            TextTable table = new TextTable(List.of("name", "origin", "safety", "title"));
            for (PresetView p : all) {
                table.add(List.of(p.name(), p.origin(), p.safety() ? "caution" : "", p.title()), List.of());
            }
            table.print(spec.commandLine().getOut());
            return SieveCli.OK;
        }
    }

    @Command(name = "show", description = "One preset: its text, reason and source, and the caution for safety presets.")
    static final class Show implements Callable<Integer> {
        @Spec
        CommandSpec spec;
        @Mixin
        DatabaseOption database;
        @Parameters(index = "0", paramLabel = "NAME", description = "The preset's name (or a saved preset's id).")
        String name;

        @Override
        public Integer call() {
            PresetView p = find(database.url, name);
            PrintWriter out = spec.commandLine().getOut();
            out.println(p.title() + "  (" + p.name() + ", " + p.origin() + ")");
            out.println("Requirement: " + p.text());
            if (p.reason() != null) {
                out.println("Why: " + p.reason());
                out.println("Source: " + p.source());
                out.println("Serves: " + p.job());
            }
            if (p.note() != null && !p.note().isEmpty()) {
                out.println("Note: " + p.note());
            }
            out.println("Run it: search --preset " + p.key());
            if (p.caution() != null) {
                out.println("Caution: " + p.caution());
            }
            out.flush();
            return SieveCli.OK;
        }
    }

    @Command(name = "export", description = "Write the library's saved presets to a presets file (JSON, format "
            + PresetFile.FORMAT + "); the built-in ones travel with the program.")
    static final class Export implements Callable<Integer> {
        @Spec
        CommandSpec spec;
        @Mixin
        DatabaseOption database;
        @Option(names = "--to", required = true, paramLabel = "FILE", description = "The file to write; not overwritten.")
        Path target;

        @Override
        public Integer call() {
            if (Files.exists(target)) {
                throw new ParameterException(spec.commandLine(), "'" + target + "' exists; give a new file name");
            }
            Object file;
            try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
                file = context.getBean(PresetLibrary.class).export(PresetCaller.LOCAL, false);
            }
            Path folder = target.toAbsolutePath().getParent();
            try {
                Path partial = Files.createTempFile(folder, ".presets-", ".partial");
                Files.writeString(partial, JSON.writerWithDefaultPrettyPrinter().writeValueAsString(file), StandardCharsets.UTF_8);
                Files.move(partial, target, StandardCopyOption.ATOMIC_MOVE);
            } catch (IOException e) {
                throw new CliFailure(SieveCli.FAILED, "cannot write " + target + ": " + e.getMessage());
            }
            int count = ((List<?>) ((java.util.Map<?, ?>) file).get("presets")).size();
            spec.commandLine().getOut().println("wrote " + count + " presets to " + target);
            spec.commandLine().getOut().flush();
            return SieveCli.OK;
        }
    }

    @Command(name = "import", description = "Save every preset of a presets file, or none: a bad entry or a name the"
            + " library already holds is named and nothing is saved.")
    static final class Import implements Callable<Integer> {
        @Spec
        CommandSpec spec;
        @Mixin
        DatabaseOption database;
        @Option(names = "--from", required = true, paramLabel = "FILE", description = "The presets file to read.")
        Path source;

        @Override
        public Integer call() {
            JsonNode file;
            try {
                if (Files.size(source) > MAX_FILE_BYTES) {
                    throw new CliFailure(SieveCli.USAGE, source + " is larger than " + MAX_FILE_BYTES
                            + " bytes; a presets file is small");
                }
                file = JSON.readTree(Files.readString(source, StandardCharsets.UTF_8));
            } catch (IOException e) {
                throw new CliFailure(SieveCli.USAGE, "cannot read " + source + ": " + e.getMessage());
            } catch (tools.jackson.core.JacksonException e) {
                throw new CliFailure(SieveCli.USAGE, source + " is not JSON: " + e.getOriginalMessage());
            }
            int stored;
            try (ConfigurableApplicationContext context = LibraryContext.start(database.url)) {
                stored = context.getBean(PresetLibrary.class).importFile(PresetCaller.LOCAL, file, false).size();
            } catch (FieldException | PresetNameTakenException | PresetTextException e) {
                throw new CliFailure(SieveCli.USAGE, "nothing imported: " + e.getMessage());
            }
            spec.commandLine().getOut().println("imported " + stored + " presets from " + source);
            spec.commandLine().getOut().flush();
            return SieveCli.OK;
        }
    }

    /** A preset by name: the catalogue without opening the library, else the library's saved presets. */
    static PresetView find(String dbUrl, String name) {
        java.util.Optional<PresetView> builtIn = PresetLibrary.builtIn(name);
        if (builtIn.isPresent()) {
            return builtIn.get();
        }
        try (ConfigurableApplicationContext context = LibraryContext.start(dbUrl)) {
            return context.getBean(PresetLibrary.class).find(PresetCaller.LOCAL, name);
        } catch (PresetNotFoundException e) {
            throw new CliFailure(SieveCli.USAGE, e.getMessage() + " (list them with: presets list)");
        }
    }
}
