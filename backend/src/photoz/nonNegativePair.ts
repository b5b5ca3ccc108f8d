/**
 * Least squares with two non-negative amplitudes, in the normal-equation sums a photometric fit
 * already has: for models M₁, M₂ and weighted fluxes, n_i = Σ w F M_i, d_i = Σ w M_i², c = Σ w M₁ M₂.
 * χ²(a₁, a₂) = Σ w F² − 2(a₁n₁ + a₂n₂) + a₁²d₁ + 2a₁a₂c + a₂²d₂ is convex, so its minimum over
 * a₁, a₂ ≥ 0 is either the unconstrained solution (when both amplitudes come out positive) or lies
 * on an edge a₁ = 0 or a₂ = 0, where it is the one-template clipped fit max(0, n_i/d_i).
 */
export interface PairSolution {
  a1: number;
  a2: number;
  /** How much χ² falls below Σ w F² (the zero model's χ²): a₁n₁ + a₂n₂ at the optimum. */
  reduction: number;
}

/** Relative size of d₁d₂ − c² under which two models count as the same shape (no 2 × 2 solve). */
const COLLINEAR = 1e-10;

/**
 * The χ² reduction of the interior (both amplitudes > 0) solution, or 0 when the optimum is not
 * interior (the edges are the single-template fits the caller already has). Allocation-free, for
 * the fit's inner loop.
 */
export function interiorPairReduction(n1: number, n2: number, d1: number, d2: number, c: number): number {
  const det = d1 * d2 - c * c;
  if (!(det > COLLINEAR * d1 * d2)) return 0;
  const a1 = n1 * d2 - n2 * c;
  const a2 = n2 * d1 - n1 * c;
  if (!(a1 > 0 && a2 > 0)) return 0;
  return (a1 * n1 + a2 * n2) / det;
}

/** The full non-negative solution (interior or best edge, or the zero model). */
export function solveNonNegativePair(n1: number, n2: number, d1: number, d2: number, c: number): PairSolution {
  const det = d1 * d2 - c * c;
  if (det > COLLINEAR * d1 * d2) {
    const a1 = (n1 * d2 - n2 * c) / det;
    const a2 = (n2 * d1 - n1 * c) / det;
    if (a1 > 0 && a2 > 0) return { a1, a2, reduction: a1 * n1 + a2 * n2 };
  }
  const r1 = n1 > 0 && d1 > 0 ? (n1 * n1) / d1 : 0;
  const r2 = n2 > 0 && d2 > 0 ? (n2 * n2) / d2 : 0;
  if (r1 === 0 && r2 === 0) return { a1: 0, a2: 0, reduction: 0 };
  return r1 >= r2 ? { a1: n1 / d1, a2: 0, reduction: r1 } : { a1: 0, a2: n2 / d2, reduction: r2 };
}
