/**
 * What the tests of every module share, kept out of production code: {@link
 * org.spectralsieve.testsupport.SharedFolder} finds the shared reference files beside the repository and
 * skips a test, saying why, where they are absent; {@link org.spectralsieve.testsupport.ReadsSharedFolder}
 * marks the tests that read them, so CI can run exactly those again without the folder.
 *
 * <p>A module of its own because the importers must not depend on the backend, and both need the helper.
 */
package org.spectralsieve.testsupport;
