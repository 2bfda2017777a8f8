import { Matrix as MlMatrix, SingularValueDecomposition, pseudoInverse } from 'ml-matrix';
import { RANK_RELATIVE_TOLERANCE, type Matrix } from '../engine/index.js';

/** The reset gain, or why the output matrix cannot give the state back. */
export type ResetGain = { gain: Matrix; note: null } | { gain: null; note: string };

/**
 * What `reset` means for a general output matrix C (p×n): the twin restarts from the state that
 * explains the measurement best. With the prior estimate x̂ and its output ŷ = C x̂ + D u, the
 * least-squares state is x = x̂ + C⁺ (y − ŷ) with C⁺ = (CᵀC)⁻¹Cᵀ, which needs C to have full column
 * rank (every state seen by some combination of outputs; p ≥ n). For C = I (and D = 0, y0 = x0)
 * that is exactly x = y, the measured state. When C has lower rank some states are not measured at
 * all and no reading can reset them: the twin then runs free (no correction), and says so.
 */
export function resetGain(C: Matrix, states: number): ResetGain {
  const outputs = C.length;
  if (outputs < states) {
    return {
      gain: null,
      note: `reset needs every state measured, but ${outputs} outputs cannot give ${states} states back: the twin runs free`,
    };
  }
  const c = new MlMatrix(C);
  const singular = new SingularValueDecomposition(c, { autoTranspose: true }).diagonal;
  const largest = Math.max(...singular);
  const rank = singular.filter((s) => s > RANK_RELATIVE_TOLERANCE * largest).length;
  if (!(largest > 0) || rank < states) {
    return {
      gain: null,
      note: `reset needs C of full column rank, but rank C = ${rank} < ${states} states: the twin runs free`,
    };
  }
  return { gain: pseudoInverse(c).to2DArray(), note: null };
}
