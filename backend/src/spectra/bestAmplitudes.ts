/** Most basis vectors a template bin may fit at once. */
export const MAX_COMPONENTS = 6;
const sub = new Float64Array(MAX_COMPONENTS * MAX_COMPONENTS);
const rhs = new Float64Array(MAX_COMPONENTS);
const sol = new Float64Array(MAX_COMPONENTS);
const idx = new Int32Array(MAX_COMPONENTS);
const chol = new Float64Array(MAX_COMPONENTS * MAX_COMPONENTS);

/**
 * Largest χ² reduction rᵀa with a = A⁻¹r over all subsets of the m ≤ MAX_COMPONENTS components
 * whose amplitudes come out non-negative (the non-negative least-squares optimum for such small m
 * is one of these subsets). A is the m×m Gram matrix Σ w T_a T_b, r the vector Σ w f T_a.
 *
 * @param a row-major m×m Gram matrix
 * @param r length-m projection vector
 * @param amplitudes output: best amplitudes (0 for components left out)
 * @returns the χ² reduction (≥ 0)
 */
export function bestAmplitudes(a: Float64Array, r: Float64Array, m: number, amplitudes: Float64Array): number {
  amplitudes.fill(0, 0, m);
  // With every projection ≤ 0, no non-negative amplitudes help: the reduction 2aᵀr − aᵀAa ≤ 2aᵀr ≤ 0.
  let anyPositive = false;
  for (let p = 0; p < m; p++) if (r[p]! > 0) anyPositive = true;
  if (!anyPositive) return 0;
  if (m === 3) return bestOfThree(a, r, amplitudes);
  if (m > 3) return bestOfMany(a, r, m, amplitudes);
  return bestOverSubsets(a, r, m, amplitudes, 0);
}

/** Scratch per problem size for bestOfMany (it recurses, so each depth has its own). */
const leadScratch = Array.from({ length: MAX_COMPONENTS + 1 }, (_, k) => ({ a: new Float64Array(k * k), r: new Float64Array(k), x: new Float64Array(k) }));

/**
 * m > 3 components: the optimum over the first m − 1 (recursively), then the Karush–Kuhn–Tucker
 * test for the last one — with its amplitude at 0, the χ² gradient along it, r_last − Σ A_last,j x_j,
 * must be ≤ 0. The problem is convex, so passing that test makes the (m − 1)-optimum the optimum;
 * failing it means the optimum uses the last component, and only subsets holding it are tried
 * (half of them). Most shifts pass: a variant component (a broad Balmer line) rarely helps.
 */
function bestOfMany(a: Float64Array, r: Float64Array, m: number, amplitudes: Float64Array): number {
  const k = m - 1;
  const lead = leadScratch[k]!;
  for (let p = 0; p < k; p++) {
    lead.r[p] = r[p]!;
    for (let q = 0; q < k; q++) lead.a[p * k + q] = a[p * m + q]!;
  }
  const reduction = bestAmplitudes(lead.a, lead.r, k, lead.x);
  let gradient = r[k]!;
  for (let j = 0; j < k; j++) gradient -= a[k * m + j]! * lead.x[j]!;
  if (!(a[k * m + k]! > 0) || gradient <= 0) {
    amplitudes.set(lead.x.subarray(0, k));
    amplitudes[k] = 0;
    return reduction;
  }
  return bestOverSubsets(a, r, m, amplitudes, 1 << k);
}

/**
 * The largest χ² reduction over the subsets of components that include `required` (a bit mask),
 * each solved unconstrained and kept when its amplitudes are all ≥ 0.
 */
function bestOverSubsets(a: Float64Array, r: Float64Array, m: number, amplitudes: Float64Array, required: number): number {
  let best = 0;
  amplitudes.fill(0, 0, m);
  for (let mask = (1 << m) - 1; mask >= 1; mask--) {
    if ((mask & required) !== required) continue;
    let k = 0;
    for (let c = 0; c < m; c++) if (mask & (1 << c)) idx[k++] = c;
    let ok = true;
    for (let p = 0; p < k; p++) {
      if (!(a[idx[p]! * m + idx[p]!]! > 0)) ok = false;
      rhs[p] = r[idx[p]!]!;
      for (let q = 0; q < k; q++) sub[p * k + q] = a[idx[p]! * m + idx[q]!]!;
    }
    if (!ok || !solveSmall(sub, rhs, sol, k)) continue;
    let reduction = 0;
    let feasible = true;
    for (let p = 0; p < k; p++) {
      if (sol[p]! < 0) feasible = false;
      reduction += sol[p]! * rhs[p]!;
    }
    if (feasible && reduction > best) {
      best = reduction;
      amplitudes.fill(0, 0, m);
      for (let p = 0; p < k; p++) amplitudes[idx[p]!] = sol[p]!;
    }
    // The unconstrained least-squares optimum over all m components, when non-negative, is the
    // global optimum: no subset can reduce χ² further.
    if (feasible && k === m) return best;
  }
  return best;
}

/**
 * bestAmplitudes for three components, written out: the full system, then the three pairs, then
 * the three singles, keeping the largest reduction whose amplitudes are all ≥ 0 (the same answer
 * as the subset loop, without building index arrays; most scan time of three-component templates
 * went there).
 */
function bestOfThree(a: Float64Array, r: Float64Array, amplitudes: Float64Array): number {
  const a00 = a[0]!, a01 = a[1]!, a02 = a[2]!, a11 = a[4]!, a12 = a[5]!, a22 = a[8]!;
  const r0 = r[0]!, r1 = r[1]!, r2 = r[2]!;
  const ok0 = a00 > 0, ok1 = a11 > 0, ok2 = a22 > 0;
  if (ok0 && ok1 && ok2 && solveSmall(a, r, sol, 3) && sol[0]! >= 0 && sol[1]! >= 0 && sol[2]! >= 0) {
    amplitudes[0] = sol[0]!;
    amplitudes[1] = sol[1]!;
    amplitudes[2] = sol[2]!;
    return sol[0]! * r0 + sol[1]! * r1 + sol[2]! * r2;
  }
  let best = 0;
  let b0 = 0, b1 = 0, b2 = 0;
  // Pairs (p, q): Cramer on [[a_pp, a_pq], [a_pq, a_qq]]; scalars only (this runs per shift).
  if (ok0 && ok1) {
    const det = a00 * a11 - a01 * a01;
    if (det > 1e-6 * a00 * a11) {
      const x0 = (r0 * a11 - a01 * r1) / det;
      const x1 = (a00 * r1 - a01 * r0) / det;
      const red = x0 * r0 + x1 * r1;
      if (x0 >= 0 && x1 >= 0 && red > best) {
        best = red;
        b0 = x0;
        b1 = x1;
        b2 = 0;
      }
    }
  }
  if (ok0 && ok2) {
    const det = a00 * a22 - a02 * a02;
    if (det > 1e-6 * a00 * a22) {
      const x0 = (r0 * a22 - a02 * r2) / det;
      const x2 = (a00 * r2 - a02 * r0) / det;
      const red = x0 * r0 + x2 * r2;
      if (x0 >= 0 && x2 >= 0 && red > best) {
        best = red;
        b0 = x0;
        b1 = 0;
        b2 = x2;
      }
    }
  }
  if (ok1 && ok2) {
    const det = a11 * a22 - a12 * a12;
    if (det > 1e-6 * a11 * a22) {
      const x1 = (r1 * a22 - a12 * r2) / det;
      const x2 = (a11 * r2 - a12 * r1) / det;
      const red = x1 * r1 + x2 * r2;
      if (x1 >= 0 && x2 >= 0 && red > best) {
        best = red;
        b0 = 0;
        b1 = x1;
        b2 = x2;
      }
    }
  }
  if (ok0 && r0 > 0 && (r0 * r0) / a00 > best) {
    best = (r0 * r0) / a00;
    b0 = r0 / a00;
    b1 = 0;
    b2 = 0;
  }
  if (ok1 && r1 > 0 && (r1 * r1) / a11 > best) {
    best = (r1 * r1) / a11;
    b0 = 0;
    b1 = r1 / a11;
    b2 = 0;
  }
  if (ok2 && r2 > 0 && (r2 * r2) / a22 > best) {
    best = (r2 * r2) / a22;
    b0 = 0;
    b1 = 0;
    b2 = r2 / a22;
  }
  amplitudes[0] = b0;
  amplitudes[1] = b1;
  amplitudes[2] = b2;
  return best;
}

/** Solves a k×k Gram system (k ≤ 3) by Cramer's rule; false unless it is safely positive definite. */
function solveSmall(a: Float64Array, b: Float64Array, x: Float64Array, k: number): boolean {
  if (k === 1) {
    x[0] = b[0]! / a[0]!;
    return Number.isFinite(x[0]!);
  }
  if (k === 2) {
    const det = a[0]! * a[3]! - a[1]! * a[2]!;
    if (!(det > 1e-6 * a[0]! * a[3]!)) return false;
    x[0] = (b[0]! * a[3]! - a[1]! * b[1]!) / det;
    x[1] = (a[0]! * b[1]! - b[0]! * a[2]!) / det;
    return true;
  }
  if (k > 3) return solveCholesky(a, b, x, k);
  const a00 = a[0]!, a01 = a[1]!, a02 = a[2]!, a10 = a[3]!, a11 = a[4]!, a12 = a[5]!, a20 = a[6]!, a21 = a[7]!, a22 = a[8]!;
  const c00 = a11 * a22 - a12 * a21;
  const c01 = a12 * a20 - a10 * a22;
  const c02 = a10 * a21 - a11 * a20;
  const det = a00 * c00 + a01 * c01 + a02 * c02;
  if (!(det > 1e-6 * a00 * a11 * a22)) return false;
  const b0 = b[0]!, b1 = b[1]!, b2 = b[2]!;
  x[0] = (b0 * c00 + a01 * (b2 * a12 - b1 * a22) + a02 * (b1 * a21 - b2 * a11)) / det;
  x[1] = (a00 * (b1 * a22 - b2 * a12) + b0 * c01 + a02 * (b2 * a10 - b1 * a20)) / det;
  x[2] = (a00 * (a11 * b2 - a21 * b1) + a01 * (b1 * a20 - b2 * a10) + b0 * c02) / det;
  return true;
}

/** Solves a k×k Gram system by Cholesky factorisation; false unless it is safely positive definite. */
function solveCholesky(a: Float64Array, b: Float64Array, x: Float64Array, k: number): boolean {
  for (let i = 0; i < k; i++) {
    for (let j = 0; j <= i; j++) {
      let s = a[i * k + j]!;
      for (let p = 0; p < j; p++) s -= chol[i * k + p]! * chol[j * k + p]!;
      if (i === j) {
        if (!(s > 1e-6 * a[i * k + i]!)) return false;
        chol[i * k + i] = Math.sqrt(s);
      } else chol[i * k + j] = s / chol[j * k + j]!;
    }
  }
  for (let i = 0; i < k; i++) {
    let s = b[i]!;
    for (let p = 0; p < i; p++) s -= chol[i * k + p]! * x[p]!;
    x[i] = s / chol[i * k + i]!;
  }
  for (let i = k - 1; i >= 0; i--) {
    let s = x[i]!;
    for (let p = i + 1; p < k; p++) s -= chol[p * k + i]! * x[p]!;
    x[i] = s / chol[i * k + i]!;
  }
  return true;
}
