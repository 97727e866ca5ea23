package org.spectralsieve.bench;

import static org.spectralsieve.bench.BenchStats.ms;
import static org.spectralsieve.bench.BenchStats.percentile;

import java.io.File;
import java.lang.reflect.Method;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.util.Arrays;
import org.junit.jupiter.api.Test;

/**
 * The plain search of {@link SearchBenchmark} by an earlier build's core beside this build's, alternated in one
 * loop in one JVM, so both see the same load (run by {@code -Pbench}; skipped unless
 * {@code -Dbench.earlierClasses=DIR[,DIR…]} names the earlier build's compiled classes, e.g. {@code git archive}
 * of an earlier commit's core packages and {@code SyntheticCurves} compiled with {@code javac}). Each side is
 * loaded by its own class loader with {@link SideOfTheComparison} and builds its own store of the same curves.
 * Prints {@code BENCH store-scan-vs-earlier curves=N mode=fixed|solve variant=earlier|this p50_ms p95_ms
 * whole_p50_ms whole_p95_ms same_rows=true|false}. Switches: {@code -Dbench.sizes=1000000},
 * {@code -Dbench.runs=31}.
 */
class EarlierBuildSearchBenchmark {

    @Test
    void earlierBuildBesideThisOne() throws Exception {
        String earlier = System.getProperty("bench.earlierClasses", "");
        if (earlier.isBlank()) {
            System.out.println("BENCH store-scan-vs-earlier skipped: no -Dbench.earlierClasses");
            return;
        }
        URL here = SideOfTheComparison.class.getProtectionDomain().getCodeSource().getLocation();
        URL main = ThisBuild.mainClasses();
        String[] variants = {"earlier", "this"};
        URL[][] paths = {append(urls(earlier), here), {main, here}};
        int runs = BenchStats.intProperty("bench.runs", 31);
        for (int n : BenchStats.intList("bench.sizes", "1000000")) {
            Object[] sides = new Object[2];
            Method[] search = new Method[2];
            for (int v = 0; v < 2; v++) {
                // the platform loader as parent: neither side sees the other's (or this class loader's) core
                ClassLoader loader = new URLClassLoader(paths[v], ClassLoader.getPlatformClassLoader());
                Class<?> side = loader.loadClass(SideOfTheComparison.class.getName());
                sides[v] = side.getConstructor(int.class).newInstance(n);
                search[v] = side.getMethod("search", String.class);
            }
            for (String mode : new String[] {"fixed", "solve"}) {
                for (int i = 0; i < 8; i++) {
                    for (int v = 0; v < 2; v++) {
                        search[v].invoke(sides[v], mode); // warm-up: JIT and caches
                    }
                }
                double[][] store = new double[2][runs];
                double[][] whole = new double[2][runs];
                String[] rows = new String[2];
                for (int i = 0; i < runs; i++) {
                    for (int v = 0; v < 2; v++) {
                        SideOfTheComparison.Timing t = SideOfTheComparison.Timing.of((double[]) search[v].invoke(sides[v], mode));
                        store[v][i] = t.storeMs();
                        whole[v][i] = t.wholeMs();
                        rows[v] = t.rows();
                    }
                }
                for (int v = 0; v < 2; v++) {
                    System.out.printf("BENCH store-scan-vs-earlier curves=%d mode=%s variant=%s p50_ms=%s p95_ms=%s"
                                    + " whole_p50_ms=%s whole_p95_ms=%s same_rows=%b%n", n, mode, variants[v],
                            ms(percentile(store[v], 50)), ms(percentile(store[v], 95)), ms(percentile(whole[v], 50)),
                            ms(percentile(whole[v], 95)), rows[0].equals(rows[1]));
                }
            }
        }
    }

    private static URL[] urls(String dirs) throws MalformedURLException {
        String[] parts = dirs.split(",");
        URL[] out = new URL[parts.length];
        for (int i = 0; i < parts.length; i++) {
            out[i] = new File(parts[i].trim()).toURI().toURL();
        }
        return out;
    }

    private static URL[] append(URL[] urls, URL last) {
        URL[] out = Arrays.copyOf(urls, urls.length + 1);
        out[urls.length] = last;
        return out;
    }

    /** Where this build's core classes are: the folder (or jar) that holds the store. */
    private static final class ThisBuild {
        static URL mainClasses() {
            return org.spectralsieve.store.SpectralStore.class.getProtectionDomain().getCodeSource().getLocation();
        }
    }
}
