/**
 * Linear ("integral") estimate of the gravity-restrained Washburn parameters from data.
 *
 * Multiplying dh/dt = a/h − b by h and integrating from h(0) = 0 gives
 *   h(t)²/2 = a·t − b·∫₀ᵗ h dt′,
 * which is LINEAR in (a, b): a least-squares fit of y²/2 on the two regressors t and −∫y dt
 * (no intercept) estimates a and b without iteration. The integral is the trapezoid rule over the
 * data, with the first segment from the origin taken as ⅔·t₀·y₀ (exact for early Washburn rise
 * y ∝ √t). Used for starting values of the Levenberg–Marquardt fit and for the automatic window.
 * The same relation holds for masses (m ∝ h) with a and b in mass units.
 */
export function integralGravityEstimate(t: ArrayLike<number>, y: ArrayLike<number>): { a: number; b: number } {
  const n = t.length;
  let integral = 0;
  let s11 = 0;
  let s12 = 0;
  let s22 = 0;
  let r1 = 0;
  let r2 = 0;
  for (let i = 0; i < n; i++) {
    integral += i === 0 ? (2 / 3) * t[0] * y[0] : 0.5 * (t[i] - t[i - 1]) * (y[i] + y[i - 1]);
    const x1 = t[i];
    const x2 = -integral;
    const Y = 0.5 * y[i] * y[i];
    s11 += x1 * x1;
    s12 += x1 * x2;
    s22 += x2 * x2;
    r1 += x1 * Y;
    r2 += x2 * Y;
  }
  const det = s11 * s22 - s12 * s12;
  if (!(Math.abs(det) > 1e-14 * s11 * s22) || !Number.isFinite(det)) {
    // Collinear regressors (no curvature in the data): a Washburn-only estimate.
    return { a: s11 > 0 ? r1 / s11 : 0, b: 0 };
  }
  return { a: (r1 * s22 - r2 * s12) / det, b: (s11 * r2 - s12 * r1) / det };
}
