package org.spectralsieve.search;

import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.spectralsieve.library.Geometry;
import org.spectralsieve.library.JooqLibraryRepository;
import org.spectralsieve.library.Material;
import org.spectralsieve.library.SampleInfo;
import org.spectralsieve.library.SampleRescaling;
import org.spectralsieve.requirement.Candidate;
import org.spectralsieve.requirement.MaterialEvaluation;
import org.spectralsieve.requirement.MaterialJudge;
import org.spectralsieve.requirement.RankedRow;
import org.spectralsieve.requirement.Ranking;
import org.spectralsieve.requirement.Requirement;
import org.spectralsieve.requirement.StackLayer;

/**
 * The reference the search property tests compare {@link SearchService} with: every admitted sample judged
 * exactly, its curve read from the database, with its material's other samples ({@link MaterialJudge}), then
 * ranked as documented. Built from the public core only, never from the code under test (store, screens, cache).
 */
final class ExactReference {

    private ExactReference() {
    }

    static List<RankedRow> judgeEverySample(JooqLibraryRepository library, Requirement requirement,
                                            Optional<StackLayer> layer, List<Material> materials, int limit) {
        boolean diffuseLayer = layer.map(l -> library.findSample(l.sampleId()).orElseThrow().geometry() == Geometry.TOTAL)
                .orElse(false);
        List<MaterialEvaluation> all = new ArrayList<>();
        Set<Long> total = new HashSet<>();
        for (Material m : materials) {
            List<Candidate> admitted = new ArrayList<>();
            for (SampleInfo s : m.samples()) {
                if (requirement.materialClass().map(c -> c.equals(m.materialClass().label())).orElse(true)
                        && requirement.admitsGeometry(s.geometry().label())) {
                    // the shared rule: diffuse and scattering samples are held at their measured thickness
                    SampleRescaling rescaling = SampleRescaling.of(m, s);
                    Candidate candidate = new Candidate(s.id(), m.id(), m.name(), library.findCurve(s.id()).orElseThrow(),
                            s.thicknessMm(), rescaling.rescalable(), m.refractiveIndex(), SearchService.made(m),
                            s.geometry() == Geometry.TOTAL || diffuseLayer, rescaling.reason());
                    // the sample's curves in other states, read straight from the database
                    admitted.add(candidate.withStates(library.findStateCurves(s.id())));
                    if (s.geometry() == Geometry.TOTAL) {
                        total.add(s.id());
                    }
                }
            }
            // each material's samples judged together: the nearest measurement speaks for each thickness
            if (!admitted.isEmpty()) {
                all.addAll(MaterialJudge.evaluate(admitted, requirement, layer));
            }
        }
        return diffuseLast(requirement, all, total, limit);
    }

    /**
     * The documented order (docs/geometry-and-edges.md): with a see-through clause (luminous transmittance) that
     * does not accept total transmittance, the rows judged in regular geometry first, then the materials with none.
     */
    private static List<RankedRow> diffuseLast(Requirement requirement, List<MaterialEvaluation> all, Set<Long> total,
                                               int limit) {
        boolean seeThrough = requirement.clauses().stream().anyMatch(c -> c.text().startsWith("luminous"));
        if (!seeThrough || requirement.acceptsTotalTransmittance()) {
            return Ranking.rank(all, limit);
        }
        List<MaterialEvaluation> regular = all.stream().filter(e -> !total.contains(e.evaluation().sampleId())).toList();
        List<RankedRow> rows = new ArrayList<>(Ranking.rank(regular, limit));
        Set<Long> first = new HashSet<>();
        regular.forEach(e -> first.add(e.materialId()));
        List<MaterialEvaluation> rest = all.stream()
                .filter(e -> !first.contains(e.materialId()) && total.contains(e.evaluation().sampleId())).toList();
        for (RankedRow row : Ranking.rank(rest, limit - rows.size())) {
            rows.add(new RankedRow(rows.size() + 1, row.materialId(), row.materialName(), row.evaluation()));
        }
        return rows;
    }
}
