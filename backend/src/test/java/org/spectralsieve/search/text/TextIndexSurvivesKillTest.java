package org.spectralsieve.search.text;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * A process killed (SIGKILL) while it updates the text index on disk never leads to a wrong answer: a child
 * JVM changes the library on an H2 file database and updates the index in a loop ({@link IndexUpdatingProcess});
 * it is killed after a random number of committed updates and a random pause, so usually in the middle of a
 * database write or an index update; then this JVM opens the database and the folder as the next start would
 * and must answer exactly as a fresh rebuild from the database does. Round after round on the same folder.
 *
 * <p>Run by the {@code crash} profile (a JVM start per round is too slow for the normal suite, which has the
 * in-process version in {@link TextIndexOnDiskTest}); {@code -Dsieve.crash.indexRounds=N},
 * {@code -Dsieve.crash.seed=N} (printed). Also here, because it starts a JVM too: a folder held by another
 * process. Prints {@code BENCH index-kill rounds=… opened=… updated=… rebuilt=…}.
 */
@Tag("crash")
class TextIndexSurvivesKillTest {

    private static final int MAX_UPDATES_BEFORE_KILL = 6;
    /**
     * After the last counted update the kill waits for the child's next database commit ("changed") and then a
     * pause of up to this long: short enough that it often lands in the index update that follows (between the
     * database's commit and the index's), sometimes later, in the next database write.
     */
    private static final int MAX_KILL_PAUSE_MS = 60;

    @TempDir
    Path work;

    @Test
    void afterEveryKillTheIndexAnswersAsAFreshRebuild() throws Exception {
        int rounds = Integer.getInteger("sieve.crash.indexRounds", 12);
        long seed = Long.getLong("sieve.crash.seed", System.nanoTime());
        System.out.println("index kill test: seed=" + seed + " rounds=" + rounds + " (replay with -Dsieve.crash.seed=" + seed + ")");
        Random random = new Random(seed);
        String url = "jdbc:h2:file:" + work.resolve("db/sieve") + ";WRITE_DELAY=0";
        Path folder = work.resolve("index");
        new TextIndexFixture(TextIndexFixture.migrated(url)).storeCorpus();
        Map<LibraryTextSearch.How, Integer> seen = new EnumMap<>(LibraryTextSearch.How.class);

        for (int round = 0; round < rounds; round++) {
            int committedBeforeKill = runAndKill(url, folder, random.nextLong(), 1 + random.nextInt(MAX_UPDATES_BEFORE_KILL),
                    random.nextInt(MAX_KILL_PAUSE_MS));

            TextIndexFixture library = new TextIndexFixture(TextIndexFixture.migrated(url));
            List<LibraryTextSearch.Refresh> refreshes = new ArrayList<>();
            LibraryTextSearch search = new LibraryTextSearch(library.library(), folder, refreshes::add);
            try {
                List<String> answers = TextIndexFixture.answers(search);
                assertThat(search.inMemory()).as("round %d: the folder is free after the kill", round).isFalse();
                assertThat(answers).as("round %d (seed %d)", round, seed).isEqualTo(library.freshAnswers());
            } finally {
                search.close();
            }
            LibraryTextSearch.Refresh first = refreshes.get(0);
            seen.merge(first.how(), 1, Integer::sum);
            System.out.println("round " + round + ": " + committedBeforeKill + " update(s) committed before the kill; next start "
                    + first.how() + " (" + first.why() + ")");
        }
        System.out.println("BENCH index-kill rounds=" + rounds + " opened=" + seen.getOrDefault(LibraryTextSearch.How.OPENED, 0)
                + " updated=" + seen.getOrDefault(LibraryTextSearch.How.UPDATED, 0)
                + " rebuilt=" + seen.getOrDefault(LibraryTextSearch.How.REBUILT, 0));
        // a kill never damages the folder (a Lucene commit is atomic and the stamp is in it): every start after a
        // kill opens it or brings it up to date from the change log, none has to rebuild it
        assertThat(seen.getOrDefault(LibraryTextSearch.How.REBUILT, 0)).isZero();
    }

    /**
     * Two processes on one database and one folder: the child holds the folder's write lock (an OS file lock),
     * so this process keeps its own index in memory (and logs it) and still answers as a fresh rebuild, its own
     * writes and the child's included. The database is shared over H2's automatic server mode.
     */
    @Test
    void aFolderHeldByAnotherProcessIsLeftToItAndTheQueryStillAnswers() throws Exception {
        String url = "jdbc:h2:file:" + work.resolve("shared/sieve") + ";AUTO_SERVER=TRUE;WRITE_DELAY=0";
        Path folder = work.resolve("shared-index");
        new TextIndexFixture(TextIndexFixture.migrated(url)).storeCorpus();
        Process child = start(url, folder, 7, "3");
        try {
            List<String> log = awaitLine(child, "idle");
            assertThat(log).as("the child holds the folder").anyMatch(l -> l.endsWith("in-memory=false"));

            TextIndexFixture library = new TextIndexFixture(TextIndexFixture.migrated(url));
            LibraryTextSearch search = new LibraryTextSearch(library.library(), folder);
            try {
                assertThat(TextIndexFixture.answers(search)).isEqualTo(library.freshAnswers());
                assertThat(search.inMemory()).isTrue();
                library.randomChange(new Random(8));
                assertThat(TextIndexFixture.answers(search)).isEqualTo(library.freshAnswers());
            } finally {
                search.close();
            }
        } finally {
            child.destroyForcibly();
            child.waitFor(30, TimeUnit.SECONDS);
        }
    }

    private static Process start(String url, Path folder, long seed, String... more) throws IOException {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        String classpath = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        List<String> command = new ArrayList<>(List.of(java, "-Xmx256m", "-XX:+UseSerialGC", "-XX:TieredStopAtLevel=1",
                "-Dorg.jooq.no-logo=true", "-Dorg.jooq.no-tips=true", "-cp", classpath,
                IndexUpdatingProcess.class.getName(), url, folder.toString(), Long.toString(seed)));
        command.addAll(List.of(more));
        return new ProcessBuilder(command).redirectErrorStream(true).start();
    }

    /** The child's output up to the line {@code wanted}. */
    private static List<String> awaitLine(Process child, String wanted) throws IOException {
        List<String> log = new ArrayList<>();
        BufferedReader in = new BufferedReader(new InputStreamReader(child.getInputStream(), StandardCharsets.UTF_8));
        for (String line; (line = in.readLine()) != null; ) {
            log.add(line);
            if (line.equals(wanted)) {
                return log;
            }
        }
        throw new IllegalStateException("the child ended before '" + wanted + "':\n" + String.join("\n", log));
    }

    /** Starts the child, waits for {@code updates} committed updates and {@code pauseMs}, kills it; returns the count seen. */
    private int runAndKill(String url, Path folder, long seed, int updates, int pauseMs) throws Exception {
        Process child = start(url, folder, seed);
        LinkedBlockingQueue<String> lines = new LinkedBlockingQueue<>();
        Thread reader = new Thread(() -> {
            try (BufferedReader in = new BufferedReader(new InputStreamReader(child.getInputStream(), StandardCharsets.UTF_8))) {
                for (String line; (line = in.readLine()) != null; ) {
                    lines.add(line);
                }
            } catch (IOException ended) {
                // the child was killed
            }
        });
        reader.setDaemon(true);
        reader.start();
        int committed = 0;
        List<String> log = new ArrayList<>();
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        try {
            while (committed < updates) {
                String line = lines.poll(1, TimeUnit.SECONDS);
                if (line != null) {
                    log.add(line);
                    if (line.startsWith("committed ")) {
                        assertThat(line).as("the child holds the folder").endsWith("in-memory=false");
                        committed++;
                    }
                }
                if (!child.isAlive() && lines.isEmpty()) {
                    throw new IllegalStateException("the child ended by itself (exit " + child.exitValue() + "):\n"
                            + String.join("\n", log));
                }
                if (System.nanoTime() > deadline) {
                    throw new IllegalStateException("the child committed no update in time:\n" + String.join("\n", log));
                }
            }
            while (true) {
                String line = lines.poll(1, TimeUnit.SECONDS);
                if (line != null && line.startsWith("changed ")) {
                    break;
                }
                if (!child.isAlive() || System.nanoTime() > deadline) {
                    throw new IllegalStateException("the child made no further change:\n" + String.join("\n", log));
                }
            }
            Thread.sleep(pauseMs);
        } finally {
            child.destroyForcibly(); // SIGKILL: no shutdown hook, no close of the writer or the database
            if (!child.waitFor(30, TimeUnit.SECONDS)) {
                throw new IllegalStateException("the killed child " + child.pid() + " did not end");
            }
        }
        return committed;
    }

}
