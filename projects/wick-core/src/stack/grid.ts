/**
 * Cell-centred finite-volume grid along the stack axis. Cells never straddle a layer boundary, so each
 * cell has one material; widths may vary (geometric grading within a layer).
 */
export interface StackGrid {
  readonly cellCount: number;
  /** Cell widths Δx_i, m. */
  readonly widths: Float64Array;
  /** Cell centres x_i, m from the inlet face. */
  readonly centres: Float64Array;
  /** Layer index of each cell. */
  readonly layerOf: Int32Array;
  /** Layer boundaries, m (length layers + 1). */
  readonly boundaries: Float64Array;
  /** Total length L, m. */
  readonly length: number;
}

export interface GridLayer {
  readonly thickness: number;
  readonly cells: number;
  /** Ratio of successive widths away from the inlet (1 = uniform). */
  readonly grading: number;
}

/**
 * Shares `total` cells out over layers without their own count, in proportion to thickness, at least
 * `minimum` each (more than `total` cells result when the minimum requires it).
 */
export function shareCells(
  thicknesses: readonly number[],
  fixed: readonly (number | undefined)[],
  total: number,
  minimum = 3,
): number[] {
  let fixedCount = 0;
  let freeThickness = 0;
  for (let j = 0; j < thicknesses.length; j++) {
    const c = fixed[j];
    if (c === undefined) freeThickness += thicknesses[j];
    else fixedCount += c;
  }
  const remaining = Math.max(total - fixedCount, 0);
  return thicknesses.map((t, j) => {
    const c = fixed[j];
    if (c !== undefined) return c;
    return Math.max(minimum, Math.round((remaining * t) / freeThickness));
  });
}

/** Builds the grid; widths in a layer follow w_k = w_0 r^k with Σ w_k = thickness. */
export function buildGrid(layers: readonly GridLayer[]): StackGrid {
  let cellCount = 0;
  for (const l of layers) cellCount += l.cells;
  const widths = new Float64Array(cellCount);
  const centres = new Float64Array(cellCount);
  const layerOf = new Int32Array(cellCount);
  const boundaries = new Float64Array(layers.length + 1);
  let i = 0;
  let x = 0;
  layers.forEach((l, j) => {
    const r = l.grading;
    const c = l.cells;
    const w0 = Math.abs(r - 1) < 1e-12 ? l.thickness / c : (l.thickness * (r - 1)) / (Math.pow(r, c) - 1);
    let w = w0;
    const layerStart = x;
    for (let k = 0; k < c; k++, i++) {
      widths[i] = w;
      centres[i] = x + w / 2;
      layerOf[i] = j;
      x += w;
      w *= r;
    }
    // Pin the boundary to the exact sum of thicknesses so interfaces do not drift with rounding.
    x = layerStart + l.thickness;
    boundaries[j + 1] = x;
  });
  return { cellCount, widths, centres, layerOf, boundaries, length: x };
}
