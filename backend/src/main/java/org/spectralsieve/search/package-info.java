/**
 * Requirement search as the service runs it: {@link org.spectralsieve.search.SearchService} lets the
 * in-memory store pick the shortlist (or prove misses, for requirements the store cannot rank) and then
 * judges every sample of the picked materials exactly on its stored curve, so each row a user sees comes
 * from the exact evaluator of {@code requirement}. The store is built from the database on the first
 * search and rebuilt when the library's change counter has moved since ({@code library_generation}, read
 * before every search, raised by every write of any process on the database): see {@code docs/freshness.md}.
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
