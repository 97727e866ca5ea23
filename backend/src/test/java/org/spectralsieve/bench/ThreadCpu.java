package org.spectralsieve.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;

/**
 * CPU time of this JVM's threads by what they do, read from Linux's {@code /proc/self/task} (a benchmark's
 * counter, not a product feature): the JIT's compiler threads, the collector's, the service's request
 * threads, the benchmark's own clients (they share the two cores with the service) and the rest. A thread
 * that ended between two readings takes its time with it, so the process total is read too and the
 * difference counted as {@link Group#OTHER}. Where {@code /proc} cannot be read every figure is 0.
 */
final class ThreadCpu {

    enum Group {
        JIT, GC, REQUEST, CLIENT, FORK_JOIN, OTHER;

        String label() {
            return name().toLowerCase(java.util.Locale.ROOT).replace('_', '-');
        }
    }

    /** Clock ticks per second of {@code /proc}'s times: 100 on every Linux this runs on (USER_HZ). */
    private static final double TICKS_PER_SECOND = 100;
    private static final Path TASKS = Path.of("/proc/self/task");

    private ThreadCpu() {
    }

    /** Seconds of CPU (user + system) used so far, by group; {@link Group#OTHER} includes ended threads. */
    static Map<Group, Double> now() {
        Map<Group, Double> seconds = new EnumMap<>(Group.class);
        for (Group g : Group.values()) {
            seconds.put(g, 0.0);
        }
        double process = ticks(Path.of("/proc/self/stat")) / TICKS_PER_SECOND;
        double grouped = 0;
        try (Stream<Path> tasks = Files.list(TASKS)) {
            for (Path task : tasks.toList()) {
                double s = ticks(task.resolve("stat")) / TICKS_PER_SECOND;
                Group g = groupOf(name(task));
                seconds.merge(g, s, Double::sum);
                grouped += s;
            }
        } catch (IOException | RuntimeException e) {
            return seconds;
        }
        seconds.merge(Group.OTHER, Math.max(0, process - grouped), Double::sum);
        return seconds;
    }

    /** {@code later − earlier}, group by group. */
    static Map<Group, Double> between(Map<Group, Double> earlier, Map<Group, Double> later) {
        Map<Group, Double> d = new EnumMap<>(Group.class);
        for (Group g : Group.values()) {
            d.put(g, later.getOrDefault(g, 0.0) - earlier.getOrDefault(g, 0.0));
        }
        return d;
    }

    /** The native thread names the JVM gives (the Java name cut to 15 characters). */
    static Group groupOf(String name) {
        if (name.startsWith("C1 Compiler") || name.startsWith("C2 Compiler")) {
            return Group.JIT;
        }
        if (name.startsWith("GC Thread") || name.startsWith("VM Thread") || name.startsWith("ParGC")
                || name.startsWith("G1 ") || name.startsWith("VM Periodic")) {
            return Group.GC;
        }
        if (name.startsWith("http-nio")) {
            return Group.REQUEST;
        }
        if (name.startsWith("pool-") || name.startsWith("HttpClient")) {
            return Group.CLIENT;
        }
        if (name.startsWith("ForkJoinPool")) {
            return Group.FORK_JOIN;
        }
        return Group.OTHER;
    }

    private static String name(Path task) {
        try {
            return Files.readString(task.resolve("comm")).strip();
        } catch (IOException e) {
            return "";
        }
    }

    /** utime + stime, fields 14 and 15 of a stat line (counted after the command's closing parenthesis). */
    private static long ticks(Path stat) {
        try {
            String line = Files.readString(stat);
            String[] f = line.substring(line.lastIndexOf(')') + 2).split(" ");
            return Long.parseLong(f[11]) + Long.parseLong(f[12]);
        } catch (IOException | RuntimeException e) {
            return 0;
        }
    }

    /** Readings taken every {@code periodMs} on a daemon thread, to be cut into quarters of a run afterwards. */
    static final class Recorder implements AutoCloseable {

        record Reading(double atMs, Map<Group, Double> seconds) {
        }

        private final List<Reading> readings = new ArrayList<>();
        private final Thread thread;
        private volatile boolean running = true;

        Recorder(long startNanos, long periodMs) {
            thread = new Thread(() -> {
                while (running) {
                    Reading r = new Reading((System.nanoTime() - startNanos) / 1e6, now());
                    synchronized (readings) {
                        readings.add(r);
                    }
                    try {
                        Thread.sleep(periodMs);
                    } catch (InterruptedException e) {
                        return;
                    }
                }
            }, "bench-cpu-recorder");
            thread.setDaemon(true);
            thread.start();
        }

        /** The reading nearest to {@code atMs} from the run's start. */
        Map<Group, Double> nearest(double atMs) {
            synchronized (readings) {
                Reading best = readings.get(0);
                for (Reading r : readings) {
                    if (Math.abs(r.atMs() - atMs) < Math.abs(best.atMs() - atMs)) {
                        best = r;
                    }
                }
                return best.seconds();
            }
        }

        @Override
        public void close() throws InterruptedException {
            running = false;
            thread.interrupt();
            thread.join();
        }
    }
}
