/**
 * Requirement search as the service runs it: {@link org.spectralsieve.search.SearchService} lets the
 * in-memory store pick the shortlist (or prove misses, for requirements the store cannot rank) and then
 * judges every sample of the picked materials exactly on its stored curve, so each row a user sees comes
 * from the exact evaluator of {@code requirement}. The store is built from the database on the first
 * search and rebuilt when the library's change counter has moved since ({@code library_generation}, read
 * before every search, raised by every write of any process on the database): see {@code docs/freshness.md}.
 *
 * <p>What is where in the service (one capability per class; {@code SearchService} is the public face, holds the
 * switches tests and benchmarks use and delegates to the rest):
 * <ul>
 * <li>{@link org.spectralsieve.search.StorePickedSearch}: requirements the store can rank — the store picks, each
 * picked material's samples judged best store ceiling first, the materials that could still reach the cut;</li>
 * <li>{@link org.spectralsieve.search.SnapshotHolder}: the snapshot answered from, its freshness against the change
 * counter, one rebuild at a time, installed never older than the one it replaces;</li>
 * <li>{@link org.spectralsieve.search.MaterialCandidates}: a material's admitted samples made ready for the exact
 * judgement (curves through the snapshot's cache, rescaling, made thicknesses, the memo) and a fixed layer resolved
 * to its library sample;</li>
 * <li>{@link org.spectralsieve.search.FirstBoundScreens}: a search's first bounds from the store's screens (proven
 * misses, blocks behind a layer, weighted bounds), by row or by sample id, and the rule by which a proof survives
 * the asked thickness; {@link org.spectralsieve.search.Admission}: which samples a requirement admits;</li>
 * <li>{@link org.spectralsieve.search.BoundedExactSearch}: the exact judgement of requirements the store cannot rank,
 * bounded by those first bounds (contenders, settled rows, the reserve, second bounds on a contender's own curve;
 * the rows settled by thickness in {@link org.spectralsieve.search.SettledRows}), over
 * {@link org.spectralsieve.search.BoundedJudgement}'s loop; {@link org.spectralsieve.search.EarlierExactSearch}: the
 * loop before it, the reference benchmarks and equivalence tests run beside it; as measured over the whole library
 * the contenders and the reserve come from {@link org.spectralsieve.search.SlotSweep}, a sweep over the snapshot
 * index's slots, with {@link org.spectralsieve.search.ReserveCut} choosing what is formed before the reserve;</li>
 * <li>{@link org.spectralsieve.search.DiffuseLastRanking}: the ranking with total-geometry rows after the regular
 * ones where a see-through clause asks; {@link org.spectralsieve.search.RowDecoration}: the geometry, measured
 * thickness and revisions shown beside each row.</li>
 * </ul>
 *
 * <p>{@link org.spectralsieve.search.LayerMatcher} resolves the words of a fixed layer ({@code behind 4 mm
 * clear float glass}) to one material by one deterministic rule, or refuses with the choices or
 * suggestions; {@link org.spectralsieve.search.PartInFront} does the same for the figures' {@code behind}.
 *
 * <p>{@link org.spectralsieve.search.JudgementMemo} keeps recent exact judgements of one sample, keyed on the
 * judgement's own arguments (the candidate's record, its curve by identity, the requirement, layer and span), so a
 * question asked again is answered with the exact evaluator's earlier result and never a stale one
 * ({@code docs/judgement-memo.md}).
 * Detail: {@code docs/requirement-search.md} and {@code docs/store.md}.
 */
package org.spectralsieve.search;
