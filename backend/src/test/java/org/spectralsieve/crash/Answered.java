package org.spectralsieve.crash;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CopyOnWriteArrayList;
import org.spectralsieve.crash.CrashFiles.SentFile;

/**
 * Everything the service acknowledged (answered 2xx), across all rounds: the ledger every restart is checked
 * against. An id is bound to the first file it was acknowledged for; a later acknowledgement of the same id
 * for another file or material is a reused id. A new material or sample acknowledged after a restart must also
 * get an id above every one acknowledged before it: H2's identity counters may skip values after a crash
 * (they reserve them in blocks), but must never go back.
 */
final class Answered {

    /** A curve import the service answered: the sample and material ids it gave, and the file sent. */
    record Sample(long sampleId, long materialId, String materialName, SentFile file, int round, String route) {
    }

    /** An emitter or response import the service answered with 201. */
    record Spectrum(String kind, String name, SentFile file, int round) {
    }

    private final Map<Long, Sample> samples = new ConcurrentHashMap<>();
    private final Map<Long, String> materials = new ConcurrentHashMap<>();
    private final Map<String, Spectrum> spectra = new ConcurrentHashMap<>();
    private final List<String> reused = new CopyOnWriteArrayList<>();

    /** The highest ids acknowledged before the current round: a restarted process must hand out higher ones. */
    private volatile long sampleIdsBefore;
    private volatile long materialIdsBefore;

    /** Called before each round's imports. */
    void newRound() {
        sampleIdsBefore = samples.keySet().stream().mapToLong(Long::longValue).max().orElse(0);
        materialIdsBefore = materials.keySet().stream().mapToLong(Long::longValue).max().orElse(0);
    }

    void sample(Sample s) {
        if (s.sampleId() <= sampleIdsBefore && !samples.containsKey(s.sampleId())) {
            reused.add("sample id " + s.sampleId() + " for " + s.file().name() + " (round " + s.round()
                    + ") is not above the ids acknowledged before the restart (up to " + sampleIdsBefore
                    + "): the id counter went back");
        }
        Sample earlier = samples.putIfAbsent(s.sampleId(), s);
        if (earlier != null && !earlier.file().sha256().equals(s.file().sha256())) {
            reused.add("sample id " + s.sampleId() + " was acknowledged for " + earlier.file().name() + " (round "
                    + earlier.round() + ") and again for " + s.file().name() + " (round " + s.round() + ")");
        }
        material(s.materialId(), s.materialName(), s.round());
    }

    void material(long id, String name, int round) {
        if (id <= materialIdsBefore && !materials.containsKey(id)) {
            reused.add("material id " + id + " for '" + name + "' (round " + round + ") is not above the ids"
                    + " acknowledged before the restart (up to " + materialIdsBefore + "): the id counter went back");
        }
        String earlier = materials.putIfAbsent(id, name);
        if (earlier != null && !earlier.equals(name)) {
            reused.add("material id " + id + " was acknowledged for '" + earlier + "' and in round " + round
                    + " for '" + name + "'");
        }
    }

    void spectrum(Spectrum s) {
        Spectrum earlier = spectra.putIfAbsent(s.kind() + "/" + s.name(), s);
        if (earlier != null) {
            reused.add(s.kind() + " name " + s.name() + " was acknowledged twice (names are never sent twice)");
        }
    }

    List<Sample> samples() {
        return List.copyOf(samples.values());
    }

    List<Spectrum> spectra() {
        return List.copyOf(spectra.values());
    }

    Map<Long, String> materials() {
        return Map.copyOf(materials);
    }

    List<String> reused() {
        return List.copyOf(reused);
    }

    int count() {
        return samples.size() + spectra.size();
    }

    /** An acknowledged material to store more samples under, or null when there is none yet. */
    Map.Entry<Long, String> anyMaterial(Random random) {
        List<Map.Entry<Long, String>> all = new ArrayList<>(materials.entrySet());
        if (all.isEmpty()) {
            return null;
        }
        all.sort(Map.Entry.comparingByKey()); // a seeded run picks the same one whatever the map's order
        return all.get(random.nextInt(all.size()));
    }
}
