/**
 * Key figures of a variant's results and their side-by-side comparison: what the compare table, the CSV
 * export and the report print. Pure bookkeeping on evaluator results (no physics).
 */
import type { VariantResults } from './variant';

export type BetterDirection = 'higher' | 'lower' | null;

export interface KeyFigure {
  /** Stable key across variants, e.g. 'height@60' or 'timeTo@0.02'. */
  readonly key: string;
  readonly label: string;
  /** SI unit of `value`. */
  readonly unit: string;
  readonly value: number | null;
  /** Which direction counts as better for marking the best variant; null when neither does. */
  readonly better: BetterDirection;
  /**
   * What a null `value` says, e.g. 'not reached' for a time to a target never reached; absent when null only
   * means "not available". A 'not reached' time counts as worse than any reached one when marking the best.
   */
  readonly nullMeans?: 'not reached';
}

const fmtMm = (m: number) => `${+(m * 1000).toPrecision(4)} mm`;

/** The key figures of one variant's results, in display order. */
export function keyFigures(results: VariantResults): KeyFigure[] {
  const out: KeyFigure[] = [];
  out.push({ key: 'capillaryPressure', label: 'Capillary pressure', unit: 'Pa', value: results.capillaryPressure.value, better: 'higher' });
  if (results.status !== 'ok') return out;
  const radial = results.configuration === 'radial-spread';
  const what = radial ? 'Wetted radius' : 'Height';
  out.push({ key: 'permeability', label: 'Permeability', unit: 'm^2', value: results.permeability.value, better: null });
  if (results.structure) out.push({ key: 'porosity', label: 'Porosity', unit: '1', value: results.structure.porosity, better: null });
  out.push({ key: 'equilibriumHeight', label: 'Equilibrium height', unit: 'm', value: results.equilibriumHeight, better: 'higher' });
  for (const c of results.atTimes) {
    out.push({ key: `height@${c.time}`, label: `${what} at ${c.time} s`, unit: 'm', value: c.height, better: 'higher' });
  }
  for (const c of results.toHeights) {
    out.push({
      key: `timeTo@${c.height}`,
      label: `Time to ${radial ? 'radius' : 'height'} ${fmtMm(c.height)}`,
      unit: 's',
      value: c.time,
      better: 'lower',
      nullMeans: 'not reached',
    });
  }
  const last = results.atTimes[results.atTimes.length - 1];
  if (last && last.mass !== null) {
    out.push({ key: `mass@${last.time}`, label: `Uptake at ${last.time} s`, unit: 'kg', value: last.mass, better: 'higher' });
  }
  if (results.capacity) {
    out.push(
      { key: 'capacityPerArea', label: 'Saturated capacity per area', unit: 'kg/m^2', value: results.capacity.perArea, better: 'higher' },
      { key: 'capacityPerMass', label: 'Saturated capacity per mass', unit: 'kg/kg', value: results.capacity.perMass, better: 'higher' },
    );
  }
  if (results.bands && last) {
    const b = results.bands.scalars.find((s) => s.key === `height@${last.time}`);
    if (b) {
      out.push({ key: `p10@${last.time}`, label: `${what} at ${last.time} s, P10`, unit: 'm', value: b.p10, better: 'higher' });
      out.push({ key: `p90@${last.time}`, label: `${what} at ${last.time} s, P90`, unit: 'm', value: b.p90, better: 'higher' });
    }
  }
  if (results.kelvin) {
    out.push({ key: 'kelvinRadius', label: `Kelvin radius at ${Math.round(results.kelvin.humidity * 100)} % RH`, unit: 'm', value: results.kelvin.radius, better: null });
  }
  return out;
}

export interface ComparedValue {
  readonly variantId: number;
  readonly value: number | null;
  /** value − baseline value (null when either is missing). */
  readonly delta: number | null;
  /** delta / |baseline| (null when the baseline is missing or zero). */
  readonly relativeDelta: number | null;
  readonly best: boolean;
  /** What a null value says for this variant ('not reached'); absent when the value is given or unavailable. */
  readonly note?: 'not reached';
}

export interface ComparedFigure {
  readonly key: string;
  readonly label: string;
  readonly unit: string;
  readonly better: BetterDirection;
  readonly values: readonly ComparedValue[];
}

export interface ComparableVariant<R = VariantResults> {
  readonly id: number;
  readonly results: R;
}

/**
 * Compares variants figure by figure: the union of their key figures in first-seen order, each value's delta
 * against the baseline variant, and the best value marked (ties all marked; none when `better` is null).
 */
export function compareKeyFigures<R = VariantResults>(
  variants: readonly ComparableVariant<R>[],
  baselineId: number,
  /** The figures of one result; a layer variant's by default (a stack passes its own, see variant-kinds). */
  figuresOf: (results: R) => KeyFigure[] = keyFigures as unknown as (results: R) => KeyFigure[],
): ComparedFigure[] {
  const perVariant = variants.map((v) => ({ id: v.id, figures: new Map(figuresOf(v.results).map((f) => [f.key, f])) }));
  const order: { key: string; label: string; unit: string; better: BetterDirection }[] = [];
  const seen = new Set<string>();
  for (const v of perVariant) {
    for (const f of v.figures.values()) {
      if (!seen.has(f.key)) {
        seen.add(f.key);
        order.push({ key: f.key, label: f.label, unit: f.unit, better: f.better });
      }
    }
  }
  const baseline = perVariant.find((v) => v.id === baselineId) ?? perVariant[0];
  return order.map((o) => {
    const base = baseline?.figures.get(o.key)?.value ?? null;
    const raw = perVariant.map((v) => v.figures.get(o.key)?.value ?? null);
    const notes = perVariant.map((v) => {
      const f = v.figures.get(o.key);
      return f && f.value === null ? f.nullMeans : undefined;
    });
    const present = raw.filter((x): x is number => x !== null);
    // A target never reached is the worst time of all: it still makes a reached one the best.
    const unreached = o.better === 'lower' ? notes.filter((n) => n === 'not reached').length : 0;
    const target =
      o.better === null || present.length === 0 || present.length + unreached < 2
        ? null
        : o.better === 'higher'
          ? Math.max(...present)
          : Math.min(...present);
    return {
      ...o,
      values: perVariant.map((v, i) => {
        const value = raw[i];
        const delta = value !== null && base !== null ? value - base : null;
        return {
          variantId: v.id,
          value,
          delta,
          relativeDelta: delta !== null && base !== null && base !== 0 ? delta / Math.abs(base) : null,
          best: target !== null && value !== null && value === target,
          ...(notes[i] ? { note: notes[i] } : {}),
        };
      }),
    };
  });
}
