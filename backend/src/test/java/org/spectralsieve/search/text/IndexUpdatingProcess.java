package org.spectralsieve.search.text;

import java.nio.file.Path;
import java.util.Random;

/**
 * The child process of {@link TextIndexSurvivesKillTest}: on the H2 file database and the index folder it is
 * given, it changes the library and brings the index on disk up to date, again and again, until it is killed.
 * Prints one line per change whose update committed, so the parent can kill at a random point of the stream.
 *
 * <p>Arguments: database URL, index folder, random seed, and optionally the number of changes after which it
 * stops changing and only holds the folder (prints {@code idle}) until killed.
 */
final class IndexUpdatingProcess {

    private IndexUpdatingProcess() {
    }

    public static void main(String[] args) throws InterruptedException {
        TextIndexFixture library = new TextIndexFixture(TextIndexFixture.migrated(args[0]));
        LibraryTextSearch search = new LibraryTextSearch(library.library(), Path.of(args[1]));
        Random random = new Random(Long.parseLong(args[2]));
        System.out.println("started in-memory=" + search.inMemory());
        int changes = args.length > 3 ? Integer.parseInt(args[3]) : Integer.MAX_VALUE;
        for (int i = 0; i < changes; i++) {
            String change = library.randomChange(random);
            System.out.println("changed " + i); // the database has committed; the index has not yet
            System.out.flush();
            TextIndexFixture.answers(search); // the update runs before these queries
            System.out.println("committed " + i + " " + change + " in-memory=" + search.inMemory());
            System.out.flush();
        }
        System.out.println("idle");
        System.out.flush();
        Thread.sleep(Long.MAX_VALUE);
    }
}
