import type { ResultBase } from '../api/model-spec';
import { DomainError, isDomainError, type ModelWarning } from '../errors';
import { requireInRange } from '../validate';
import { prepareTolerance, type Tolerance } from './distributions';
import type { ScalarModel } from './monte-carlo';

/**
 * One-at-a-time sensitivity (tornado chart data).
 *
 * Each toleranced input in turn is set to the low and high ends of its tolerance while every other
 * input stays nominal; the bar's swing is |y(high) − y(low)|. Bars are sorted by swing, largest
 * first; bars whose low or high end lies outside the model's validity (e.g. a contact angle past
 * 90°, a height beyond equilibrium) are ranked ahead of all others, since that input alone can
 * make the design fail. "Low" and "high" are the input distribution's quantiles at `level` and 1 − `level`
 * (default P10 and P90, matching the Monte Carlo band): exact for uniform and triangular
 * tolerances; for a normal one mean ∓ 1.2816 sd, moved inward by any truncation.
 * One-at-a-time screening ignores interactions between inputs (A. Saltelli et al., *Global
 * Sensitivity Analysis: The Primer*, Wiley 2008); use it to rank, not to add up.
 */
export interface TornadoBar {
  readonly name: string;
  /** Input values used at the low and high ends. */
  readonly inputLow: number;
  readonly inputHigh: number;
  /** Model output with this input at its low / high end (null: outside model validity there). */
  readonly outputLow: number | null;
  readonly outputHigh: number | null;
  /** |outputHigh − outputLow|; with one side invalid, |valid side − base|. */
  readonly swing: number;
  /** True when either end is outside the model's validity (such bars are ranked first). */
  readonly outsideValidity: boolean;
}

export interface TornadoInputs<K extends string> {
  readonly nominal: Readonly<Record<K, number>>;
  readonly tolerances: Readonly<Partial<Record<K, Tolerance>>>;
  readonly level: number;
}

export interface TornadoResult<K extends string> extends ResultBase<TornadoInputs<K>> {
  /** Output at the nominal inputs. */
  readonly baseOutput: number;
  /** Largest swing first. */
  readonly bars: readonly TornadoBar[];
}

export function tornado<K extends string>(
  fn: ScalarModel<K>,
  nominal: Readonly<Record<K, number>>,
  tolerances: Readonly<Partial<Record<K, Tolerance>>>,
  options: { readonly level?: number } = {},
): TornadoResult<K> {
  const level = requireInRange('level', options.level ?? 0.1, 0, 0.5, { min: true, max: true });
  const warnings: ModelWarning[] = [];
  const names = (Object.keys(tolerances) as K[]).filter((k) => tolerances[k] !== undefined).sort();
  if (names.length === 0) {
    throw new DomainError('invalid-input', 'Give a tolerance for at least one input.', 'tolerances');
  }
  let baseOutput: number;
  try {
    baseOutput = fn(nominal);
  } catch (e) {
    if (isDomainError(e)) {
      throw new DomainError(e.code, `The model refuses the nominal inputs: ${e.message}`, e.field, e.details);
    }
    throw e;
  }
  const work = { ...nominal } as Record<K, number>;
  const bars: TornadoBar[] = [];
  for (const name of names) {
    const prepared = prepareTolerance(name, tolerances[name] as Tolerance, nominal[name], warnings);
    const inputLow = prepared.quantile(level);
    const inputHigh = prepared.quantile(1 - level);
    const at = (x: number): number | null => {
      work[name] = x;
      try {
        const y = fn(work);
        return Number.isFinite(y) ? y : null;
      } catch (e) {
        if (!isDomainError(e)) throw e;
        warnings.push({
          code: 'tornado-end-outside-validity',
          message: `${name} = ${x}: ${e.message}`,
        });
        return null;
      } finally {
        work[name] = nominal[name];
      }
    };
    const outputLow = at(inputLow);
    const outputHigh = at(inputHigh);
    const swing =
      outputLow !== null && outputHigh !== null
        ? Math.abs(outputHigh - outputLow)
        : outputLow !== null
          ? Math.abs(outputLow - baseOutput)
          : outputHigh !== null
            ? Math.abs(outputHigh - baseOutput)
            : 0;
    const outsideValidity = outputLow === null || outputHigh === null;
    bars.push({ name, inputLow, inputHigh, outputLow, outputHigh, swing, outsideValidity });
  }
  bars.sort((a, b) => Number(b.outsideValidity) - Number(a.outsideValidity) || b.swing - a.swing);
  return { inputs: { nominal, tolerances, level }, warnings, baseOutput, bars };
}
