package org.spectralsieve.architecture;

import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static org.assertj.core.api.Assertions.assertThat;

import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import org.junit.jupiter.api.Test;

/**
 * The spectral math must stay plain Java so it can be tested, reused by the command line and reasoned
 * about without a container. Run as a plain JUnit test (ClassFileImporter) rather than through the
 * ArchUnit JUnit engine, so it does not depend on that engine matching the platform version.
 */
class CoreIsFrameworkFreeTest {

    private static final JavaClasses PRODUCTION = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.spectralsieve");

    @Test
    void corePackagesDependOnNoFrameworkOrPersistenceLibrary() {
        ArchRule rule = noClasses()
                .that().resideInAnyPackage(
                        "org.spectralsieve.spectrum..",
                        "org.spectralsieve.optics..",
                        "org.spectralsieve.weighting..",
                        "org.spectralsieve.requirement..")
                .should().dependOnClassesThat().resideInAnyPackage(
                        "org.springframework..",
                        "org.jooq..",
                        "org.apache.lucene..",
                        "jakarta..")
                .allowEmptyShould(true);
        // guard: an empty import would make the rule pass vacuously
        assertThat(PRODUCTION.containPackage("org.spectralsieve.spectrum")).isTrue();
        assertThat(PRODUCTION.containPackage("org.spectralsieve.optics")).isTrue();
        rule.check(PRODUCTION);
    }
}
