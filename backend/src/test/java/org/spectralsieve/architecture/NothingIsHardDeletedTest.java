package org.spectralsieve.architecture;

import static com.tngtech.archunit.core.domain.JavaCall.Predicates.target;
import static com.tngtech.archunit.core.domain.properties.HasName.Predicates.nameMatching;
import static com.tngtech.archunit.core.domain.properties.HasOwner.Predicates.With.owner;
import static com.tngtech.archunit.lang.syntax.ArchRuleDefinition.noClasses;
import static org.assertj.core.api.Assertions.assertThat;

import com.tngtech.archunit.base.DescribedPredicate;
import com.tngtech.archunit.core.domain.JavaClass;
import com.tngtech.archunit.core.domain.JavaClasses;
import com.tngtech.archunit.core.importer.ClassFileImporter;
import com.tngtech.archunit.core.importer.ImportOption;
import com.tngtech.archunit.lang.ArchRule;
import org.jooq.DSLContext;
import org.jooq.impl.DSL;
import org.junit.jupiter.api.Test;

/**
 * Undo without loss (docs/undo.md): no production code deletes a row. Samples, materials and imported
 * spectra are retired and restored; corrections add revisions. The rule looks at what the code calls, so a
 * DELETE cannot come back through jOOQ's {@code deleteFrom}/{@code delete} or a record's {@code delete()}
 * without this test failing. (A database-level cleanup for tests lives in test code, which is not checked.)
 */
class NothingIsHardDeletedTest {

    private static final JavaClasses PRODUCTION = new ClassFileImporter()
            .withImportOption(ImportOption.Predefined.DO_NOT_INCLUDE_TESTS)
            .importPackages("org.spectralsieve");

    private static final ArchRule NO_DELETE = noClasses()
            .should().callMethodWhere(target(nameMatching("delete|deleteFrom|deleteQuery|truncate"))
                    .and(target(owner(DescribedPredicate.describe("a jOOQ type",
                            (JavaClass c) -> c.getPackageName().startsWith("org.jooq"))))))
            .because("nothing is hard-deleted by the ordinary paths: retire instead (docs/undo.md)");

    @Test
    void noProductionCodeIssuesADelete() {
        NO_DELETE.check(PRODUCTION);
    }

    @Test
    void theRuleCatchesADeleteThroughJooq() {
        JavaClasses deleting = new ClassFileImporter().importClasses(Deleting.class);

        assertThat(NO_DELETE.evaluate(deleting).hasViolation()).isTrue();
    }

    /** What the rule must refuse: never called, only imported as classes. */
    static final class Deleting {
        static int wipe(DSLContext db) {
            return db.deleteFrom(DSL.table("sample")).execute();
        }
    }
}
