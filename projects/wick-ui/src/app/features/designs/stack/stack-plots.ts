import type { StackVariantResults } from 'wick-core';
import type { ChartLayout as PlotLayout, ChartTrace as PlotTrace } from '../chart';
import { PALETTE } from '../plots';

const mm = (xs: readonly number[]) => xs.map((x) => x * 1000);
const mL = (xs: readonly number[]) => xs.map((x) => x * 1e6);

/** Minutes for runs of ten minutes and more, else seconds: the unit of every stack plot's time axis. */
export function timeAxis(r: StackVariantResults): { scale: number; title: string } {
  const end = r.heatMap.times[r.heatMap.times.length - 1] ?? 0;
  return end >= 600 ? { scale: 1 / 60, title: 'Time (min)' } : { scale: 1, title: 'Time (s)' };
}

/** Dotted lines at the layer boundaries (depth axis y), named at the right-hand edge. */
function layerLines(r: StackVariantResults): { shapes: Record<string, unknown>[]; annotations: Record<string, unknown>[] } {
  const b = r.heatMap.boundaries;
  return {
    shapes: b.slice(1, -1).map((y) => ({ type: 'line', xref: 'paper', x0: 0, x1: 1, y0: y * 1000, y1: y * 1000, line: { dash: 'dot', width: 1, color: '#fff' } })),
    annotations: r.layers.map((l, j) => ({
      xref: 'paper',
      x: 1,
      xanchor: 'right',
      y: ((b[j] + b[j + 1]) / 2) * 1000,
      text: l.name,
      showarrow: false,
      font: { size: 11, color: '#fff' },
    })),
  };
}

/**
 * Saturation over depth (down) and time (across): one column per snapshot, one row per cell; the cell centres
 * are the y values, so thin layers keep their true share of the depth.
 */
export function heatMapTraces(r: StackVariantResults): PlotTrace[] {
  const { scale } = timeAxis(r);
  return [
    {
      type: 'heatmap',
      x: r.heatMap.times.map((t) => t * scale),
      y: mm(r.heatMap.depth),
      z: r.heatMap.saturation,
      transpose: true,
      zmin: 0,
      zmax: 1,
      colorscale: 'Blues',
      reversescale: false,
      colorbar: { title: { text: 'Saturation' }, thickness: 12 },
      hovertemplate: 't %{x:.3g}, depth %{y:.3g} mm: S = %{z:.2f}<extra></extra>',
      name: 'Saturation',
    },
  ];
}

export function heatMapLayout(r: StackVariantResults): PlotLayout {
  const { title } = timeAxis(r);
  return {
    xaxis: { title: { text: title } },
    yaxis: { title: { text: 'Depth below the surface (mm)' }, autorange: 'reversed' },
    ...layerLines(r),
  };
}

/** Liquid supplied, absorbed and standing on the surface (mL over the insult area). */
export function volumeTraces(r: StackVariantResults): PlotTrace[] {
  const { scale } = timeAxis(r);
  const t = r.curves.time.map((x) => x * scale);
  return [
    { x: t, y: mL(r.curves.supplied), type: 'scatter', mode: 'lines', line: { color: PALETTE[1], width: 1.5, dash: 'dash' }, name: 'Supplied' },
    { x: t, y: mL(r.curves.absorbed), type: 'scatter', mode: 'lines', line: { color: PALETTE[0], width: 2.5 }, name: 'Absorbed' },
    { x: t, y: mL(r.curves.surfaceLiquid), type: 'scatter', mode: 'lines', line: { color: PALETTE[4], width: 2 }, name: 'On the surface' },
  ];
}

export function volumeLayout(r: StackVariantResults): PlotLayout {
  return { xaxis: { title: { text: timeAxis(r).title } }, yaxis: { title: { text: 'Liquid (mL)' }, rangemode: 'tozero' } };
}

/** Depth of the wetting front, with the layer boundaries. */
export function frontTraces(r: StackVariantResults): PlotTrace[] {
  const { scale } = timeAxis(r);
  return [
    {
      x: r.curves.time.map((x) => x * scale),
      y: mm(r.curves.frontDepth),
      type: 'scatter',
      mode: 'lines',
      line: { color: PALETTE[2], width: 2, shape: 'hv' },
      name: 'Wetting front',
    },
  ];
}

export function frontLayout(r: StackVariantResults): PlotLayout {
  const lines = layerLines(r);
  return {
    xaxis: { title: { text: timeAxis(r).title } },
    yaxis: { title: { text: 'Front depth (mm)' }, autorange: 'reversed', range: [r.heatMap.boundaries[r.heatMap.boundaries.length - 1] * 1000, 0] },
    shapes: lines.shapes.map((s) => ({ ...s, line: { dash: 'dot', width: 1, color: '#888' } })),
    showlegend: false,
  };
}
