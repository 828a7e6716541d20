import type { ResultBase } from '../api/model-spec';
import type { ModelWarning } from '../errors';
import { preparePoreSizeDistribution, type PoreSizeDistribution, type PoreSizeDistributionInput } from './distribution';

export interface PoreSizeStatisticsResult extends ResultBase<PoreSizeDistributionInput> {
  readonly distribution: PoreSizeDistribution;
  /** Volume-weighted mean diameter Σ fᵢ Dᵢ, m. */
  readonly meanDiameter: number;
  /**
   * Median (D50) of the cumulative "fraction finer" curve, m: interpolated linearly in ln D between
   * the two classes around F = 0.5 (common practice for size distributions); the smallest
   * diameter when that class alone holds half the volume or more.
   */
  readonly medianDiameter: number;
  /** Diameter of the class with the largest volume fraction (first one on ties), m. */
  readonly modeDiameter: number;
  /** Volume-weighted geometric mean exp(Σ fᵢ ln Dᵢ), m. */
  readonly geometricMeanDiameter: number;
  readonly minDiameter: number;
  readonly maxDiameter: number;
}

/**
 * Summary pore sizes of a distribution (all weights are pore-VOLUME fractions).
 * Discrete classes: for a single class every figure equals its diameter.
 */
export function poreSizeStatistics(input: PoreSizeDistributionInput): PoreSizeStatisticsResult {
  const warnings: ModelWarning[] = [];
  const psd = preparePoreSizeDistribution(input, warnings);
  const { diameters: d, fractions: f, cumulativeFiner: F } = psd;
  const n = d.length;
  let mean = 0;
  let lnMean = 0;
  let mode = 0;
  for (let i = 0; i < n; i++) {
    mean += f[i] * d[i];
    lnMean += f[i] * Math.log(d[i]);
    if (f[i] > f[mode]) mode = i;
  }
  return {
    inputs: input,
    warnings,
    distribution: psd,
    meanDiameter: mean,
    medianDiameter: medianDiameter(d, F),
    modeDiameter: d[mode],
    geometricMeanDiameter: Math.exp(lnMean),
    minDiameter: d[0],
    maxDiameter: d[n - 1],
  };
}

/** Diameter at which the cumulative fraction finer reaches `level` (0 < level ≤ 1), log-linear interpolation. */
export function diameterAtFractionFiner(diameters: ArrayLike<number>, cumulativeFiner: ArrayLike<number>, level: number): number {
  const n = diameters.length;
  let k = 0;
  while (k < n - 1 && cumulativeFiner[k] < level) k++;
  if (k === 0 || cumulativeFiner[k] === cumulativeFiner[k - 1]) return diameters[k];
  const t = (level - cumulativeFiner[k - 1]) / (cumulativeFiner[k] - cumulativeFiner[k - 1]);
  return Math.exp(Math.log(diameters[k - 1]) + t * (Math.log(diameters[k]) - Math.log(diameters[k - 1])));
}

function medianDiameter(d: ArrayLike<number>, F: ArrayLike<number>): number {
  return diameterAtFractionFiner(d, F, 0.5);
}
