package org.spectralsieve.architecture;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.classes;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static org.assertj.core.api.Assertions.assertThat;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import java.util.Arrays;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * The spectral math must stay plain Java so it can be tested, reused by the command line and reasoned
 * about without a container. Run as a plain JUnit test (ClassFileImporter) rather than through the
 * ArchUnit JUnit engine, so it does not depend on that engine matching the platform version.
 *
 * <p>Which packages are which, by what they import: the core (spectrum, optics, weighting, requirement,
 * store, similarity, states) uses nothing but the JDK and itself. export and seedmodel are plain-Java tools at the edge: they
 * read the library's records, write with the importers' writer or Jackson, and must not pull in Spring,
 * jOOQ, Lucene or Jakarta either. Every other package is an edge that may.
 */
class CoreIsFrameworkFreeTest {

    private static final JavaClasses PRODUCTION = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.spectralsieve");

    private static final String[] CORE = {"spectrum", "optics", "weighting", "requirement", "store", "similarity", "states"};

    private static final String[] PLAIN_TOOLS = {"export", "seedmodel"};

    private static final String[] FRAMEWORKS = {"org.springframework..", "org.jooq..", "org.apache.lucene..",
            "jakarta..", "org.h2..", "org.flywaydb.."};

    private static String[] packages(String... names) {
        return Arrays.stream(names).map(n -> "org.spectralsieve." + n + "..").toArray(String[]::new);
    }

    @Test
    void everyNamedPackageExistsSoNoRuleHoldsVacuously() {
        Stream.concat(Arrays.stream(CORE), Arrays.stream(PLAIN_TOOLS)).forEach(name ->
                assertThat(PRODUCTION.containPackage("org.spectralsieve." + name)).as(name).isTrue());
    }

    @Test
    void corePackagesUseOnlyTheJdkAndEachOther() {
        String[] allowed = Stream.concat(Stream.of("java.."), Arrays.stream(packages(CORE))).toArray(String[]::new);
        ArchRule rule = classes()
                .that().resideInAnyPackage(packages(CORE))
                .should().onlyDependOnClassesThat().resideInAnyPackage(allowed);
        rule.check(PRODUCTION);
    }

    @Test
    void corePackagesAndPlainToolsDependOnNoFrameworkOrPersistenceLibrary() {
        String[] plain = Stream.concat(Arrays.stream(packages(CORE)), Arrays.stream(packages(PLAIN_TOOLS)))
                .toArray(String[]::new);
        ArchRule rule = noClasses()
                .that().resideInAnyPackage(plain)
                .should().dependOnClassesThat().resideInAnyPackage(FRAMEWORKS);
        rule.check(PRODUCTION);
    }
}
