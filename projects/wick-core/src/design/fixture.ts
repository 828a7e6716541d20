/**
 * The shared variant fixture: variant inputs with the key results wick-core produced for them
 * (`fixture/variants.json`, written by `fixture/generate.ts`). The wick-core suite, the server suite
 * (recompute through the service) and the UI suite (recompute in the browser) all compare against it with
 * {@link fixtureMismatches}, so the three places agree to round-off.
 */
import type { EvaluateVariantOptions, VariantInputs, VariantResults } from './variant';

export interface FixtureCase {
  readonly name: string;
  readonly inputs: VariantInputs;
  readonly options: EvaluateVariantOptions;
  /** Flat key → value (SI) from {@link fixtureKeys}. */
  readonly expected: Readonly<Record<string, number | string | boolean | null>>;
}

export interface VariantFixture {
  readonly coreVersion: string;
  readonly note: string;
  readonly cases: readonly FixtureCase[];
}

/** Flattens the results that matter to a reader into `key → value`; curves are sampled at a few points. */
export function fixtureKeys(r: VariantResults): Record<string, number | string | boolean | null> {
  const out: Record<string, number | string | boolean | null> = {
    status: r.status,
    capillaryPressure: r.capillaryPressure.value,
  };
  if (r.status !== 'ok') return out;
  out['a'] = r.coefficients.a;
  out['b'] = r.coefficients.b;
  out['permeability'] = r.permeability.value;
  out['equilibriumHeight'] = r.equilibriumHeight;
  out['characteristicTime'] = r.characteristicTime;
  out['porosity'] = r.structure?.porosity ?? null;
  out['capacityPerArea'] = r.capacity?.perArea ?? null;
  out['capacityPerMass'] = r.capacity?.perMass ?? null;
  out['kelvinRadius'] = r.kelvin?.radius ?? null;
  const n = r.curves.time.length;
  for (const i of [1, Math.floor(n / 10), Math.floor(n / 2), n - 1]) {
    out[`curve.time[${i}]`] = r.curves.time[i];
    out[`curve.height[${i}]`] = r.curves.height[i];
    out[`curve.heightNoGravity[${i}]`] = r.curves.heightNoGravity[i];
    out[`curve.mass[${i}]`] = r.curves.mass?.[i] ?? null;
    if (r.bands) {
      out[`band.p10[${i}]`] = r.bands.curve.p10[i];
      out[`band.p50[${i}]`] = r.bands.curve.p50[i];
      out[`band.p90[${i}]`] = r.bands.curve.p90[i];
    }
  }
  r.atTimes.forEach((c) => {
    out[`height@${c.time}`] = c.height;
    out[`mass@${c.time}`] = c.mass;
  });
  r.toHeights.forEach((c) => {
    out[`timeTo@${c.height}`] = c.time;
    out[`timeToNoGravity@${c.height}`] = c.timeNoGravity;
  });
  r.bands?.scalars.forEach((s) => {
    out[`${s.key}.p10`] = s.p10;
    out[`${s.key}.p50`] = s.p50;
    out[`${s.key}.p90`] = s.p90;
  });
  r.tornado?.bars.forEach((b, i) => {
    out[`tornado[${i}].parameter`] = b.parameter;
    out[`tornado[${i}].swing`] = b.swing;
  });
  out['warnings'] = r.warnings.map((w) => w.code).join(',');
  return out;
}

/**
 * Differences between expected and actual key values: numbers must agree to `relTol` (relative, with an
 * absolute floor of relTol × 1e-30 for zeros), everything else exactly. Empty when they agree.
 */
export function fixtureMismatches(
  expected: Readonly<Record<string, number | string | boolean | null>>,
  actual: Readonly<Record<string, number | string | boolean | null>>,
  relTol = 1e-12,
): string[] {
  const out: string[] = [];
  const keys = new Set([...Object.keys(expected), ...Object.keys(actual)]);
  for (const k of keys) {
    const e = expected[k];
    const a = actual[k];
    if (typeof e === 'number' && typeof a === 'number') {
      if (Math.abs(a - e) > relTol * Math.max(Math.abs(e), 1e-30)) out.push(`${k}: expected ${e}, got ${a}`);
    } else if (e !== a) {
      out.push(`${k}: expected ${String(e)}, got ${String(a)}`);
    }
  }
  return out;
}
