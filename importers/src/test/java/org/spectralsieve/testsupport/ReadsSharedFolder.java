package org.spectralsieve.testsupport;

import java.lang.annotation.Documented;
import java.lang.annotation.ElementType;
import java.lang.annotation.Inherited;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;
import org.junit.jupiter.api.Tag;

/**
 * Marks a test class or method that reads the shared folder through {@link SharedFolder}. The tag lets CI
 * run exactly these tests a second time with the folder pointed somewhere empty, proving that each one
 * skips itself there instead of failing ({@code .ci/run}). {@link SharedFolder} refuses an unmarked caller,
 * so a new test cannot slip out of that run.
 */
@Target({ElementType.TYPE, ElementType.METHOD})
@Retention(RetentionPolicy.RUNTIME)
@Documented
@Inherited
@Tag(ReadsSharedFolder.TAG)
public @interface ReadsSharedFolder {

    /** The JUnit tag: {@code mvn test -Dgroups=reads-shared-folder} runs only the marked tests. */
    String TAG = "reads-shared-folder";
}
