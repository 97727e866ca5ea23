package org.spectralsieve.requirement;

import java.util.Optional;

/**
 * How one sample is judged for a thickness span: {@link #EXACT} is {@link SampleEvaluator#evaluate(Candidate,
 * Requirement, Optional, ThicknessInterval)} itself. A caller may pass another way that returns exactly what
 * {@link #EXACT} returns for the same arguments (a memo of earlier exact judgements, docs/judgement-memo.md);
 * {@link MaterialJudge} asks it once per judged sample.
 */
@FunctionalInterface
public interface SampleJudge {

    /** The exact evaluator, nothing remembered. */
    SampleJudge EXACT = SampleEvaluator::evaluate;

    SampleEvaluation evaluate(Candidate candidate, Requirement requirement, Optional<StackLayer> layer,
                              ThicknessInterval span);
}
