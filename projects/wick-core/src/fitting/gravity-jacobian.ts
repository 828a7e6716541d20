/**
 * Partial derivatives of the gravity-restrained Washburn solution h(t; a, b) of dh/dt = a/h − b,
 * h(0) = 0, with respect to a and b, for the Levenberg–Marquardt fit and its covariance.
 *
 * Implicit differentiation of the exact solution t = −h/b − (a/b²) ln(1 − x), x = b h/a
 * (Washburn 1921), with ∂t/∂h = h/(a − b h):
 *   ∂h/∂a = (h/a) · g_a(x),   g_a = [x + (1 − x) ln(1 − x)] / x²          (→ ½ as x → 0),
 *   ∂h/∂b = −(h²/a) · g_b(x), g_b = [x(2 − x) + 2(1 − x) ln(1 − x)] / x³   (→ ⅓ as x → 0).
 * For x ≤ ½ the closed forms cancel badly; the power series
 *   g_a = (1 − x) Σ_{k≥0} (k+1)/(k+2) xᵏ,  g_b = (1 − x) Σ_{k≥0} (k+1)/(k+3) xᵏ
 * are used instead (60 terms: error < 2⁻⁶⁰). Checks: b = 0 gives ∂h/∂a = h/(2a) and
 * ∂h/∂b = −h²/(3a) (from h = √(2at) and t ≈ h²/(2a) + b h³/(3a²)); x → 1 gives 1/b and −a/b²,
 * the derivatives of h_eq = a/b. The spec compares them with finite differences.
 */
export function gravityHeightDerivatives(a: number, b: number, h: number): [number, number] {
  if (h === 0) return [0, 0];
  const x = (b * h) / a;
  let ga: number;
  let gb: number;
  if (x <= 0.5) {
    let sa = 0;
    let sb = 0;
    let p = 1;
    for (let k = 0; k < 60; k++) {
      sa += ((k + 1) / (k + 2)) * p;
      sb += ((k + 1) / (k + 3)) * p;
      p *= x;
      if (p < 1e-17) break;
    }
    ga = (1 - x) * sa;
    gb = (1 - x) * sb;
  } else if (x < 1) {
    const l = (1 - x) * Math.log1p(-x);
    ga = (x + l) / (x * x);
    gb = (x * (2 - x) + 2 * l) / (x * x * x);
  } else {
    // At equilibrium (rounding can give x = 1): derivatives of h_eq = a/b.
    ga = 1;
    gb = 1;
  }
  return [(h / a) * ga, -((h * h) / a) * gb];
}
