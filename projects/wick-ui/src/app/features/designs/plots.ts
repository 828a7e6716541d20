import type { CompareVariant, VariantResultsOk } from 'wick-core';
import type { ChartLayout as PlotLayout, ChartTrace as PlotTrace } from './chart';

/** Plot colours (work on light and dark surfaces). */
export const PALETTE = ['#00838f', '#ef6c00', '#6a1b9a', '#2e7d32', '#c62828', '#1565c0', '#5d4037', '#ad1457'];

const mm = (xs: readonly (number | null)[]) => xs.map((x) => (x === null ? null : x * 1000));

/** Hover text of the uptake chart: time and length with units, three significant digits. */
const UPTAKE_HOVER = '%{x:.3g} s · %{y:.3g} mm<extra>%{fullData.name}</extra>';

/** Height (or wetted radius) against time: with and without gravity, the P10–P90 band, checkpoints, equilibrium. */
export function uptakeTraces(r: VariantResultsOk): PlotTrace[] {
  const t = r.curves.time;
  const radial = r.configuration === 'radial-spread';
  const traces: PlotTrace[] = [];
  if (r.bands) {
    traces.push(
      { x: t, y: mm(r.bands.curve.p10), type: 'scatter', mode: 'lines', line: { width: 0 }, hoverinfo: 'skip', showlegend: false, name: 'P10' },
      {
        x: t,
        y: mm(r.bands.curve.p90),
        type: 'scatter',
        mode: 'lines',
        fill: 'tonexty',
        fillcolor: 'rgba(0,131,143,0.18)',
        // Hover on the points, not the filled area: plotly otherwise builds a hit-test polygon on every redraw.
        hoveron: 'points',
        hoverinfo: 'skip',
        line: { width: 0, color: 'rgba(0,131,143,0.18)' },
        name: `P10–P90 (${r.bands.validSamples} samples)`,
      },
    );
  }
  traces.push({ x: t, y: mm(r.curves.height), type: 'scatter', mode: 'lines', line: { color: PALETTE[0], width: 2.5 }, name: radial ? 'Wetted radius' : 'With gravity', hovertemplate: UPTAKE_HOVER });
  if (!radial && r.configuration !== 'horizontal-strip') {
    traces.push({ x: t, y: mm(r.curves.heightNoGravity), type: 'scatter', mode: 'lines', line: { color: PALETTE[1], width: 1.5, dash: 'dash' }, name: 'Without gravity', hovertemplate: UPTAKE_HOVER });
  }
  // Checkpoints in one trace: reading times (circles) and targets reached (diamonds).
  const reached = r.toHeights.filter((c) => c.time !== null && c.time <= t[t.length - 1]);
  traces.push({
    x: [...r.atTimes.map((c) => c.time), ...reached.map((c) => c.time)],
    y: mm([...r.atTimes.map((c) => c.height), ...reached.map((c) => c.height)]),
    type: 'scatter',
    mode: 'markers',
    marker: {
      color: [...r.atTimes.map(() => PALETTE[2]), ...reached.map(() => PALETTE[3])],
      size: 9,
      symbol: [...r.atTimes.map(() => 'circle'), ...reached.map(() => 'diamond')],
    },
    name: 'Checkpoints',
    hovertemplate: UPTAKE_HOVER,
  });
  return traces;
}

/** 1, 2, 2.5, 5 × 10ⁿ at or above x: axis ends that change rarely while a value is being typed. */
export function niceCeil(x: number): number {
  if (!(x > 0)) return 1;
  const p = 10 ** Math.floor(Math.log10(x));
  for (const m of [1, 2, 2.5, 5, 10]) if (m * p >= x * (1 - 1e-12)) return m * p;
  return 10 * p;
}

export function uptakeLayout(r: VariantResultsOk, timeAxis: 'linear' | 'log' = 'linear'): PlotLayout {
  const radial = r.configuration === 'radial-spread';
  const eq = r.equilibriumLength;
  const t = r.curves.time;
  // Fixed, rounded ranges: no autorange pass and the same ticks between keystrokes (plotly re-measures new labels).
  // The scale follows the curve with gravity and its band; the gravity-free curve may run off the top.
  const top = Math.max(...r.curves.height, ...(r.bands ? r.bands.curve.p90 : []), eq ?? 0) * 1000;
  const tEnd = t[t.length - 1];
  // Tick labels may overhang the plot area (the margins leave room): plotly otherwise measures every label on
  // every redraw to hide the ones that would, a tenth of each keystroke's replot. The axis type is given, or
  // plotly scans the data for dates on every redraw to guess it.
  const ticks = { ticklabeloverflow: 'allow' };
  return {
    xaxis:
      timeAxis === 'log'
        ? { ...ticks, title: { text: 'Time (s, log)' }, type: 'log', range: [Math.log10(Math.max(t[1], tEnd * 1e-6)), Math.log10(tEnd)] }
        : { ...ticks, title: { text: 'Time (s)' }, type: 'linear', zeroline: false, range: [0, tEnd] },
    yaxis: { ...ticks, title: { text: radial ? 'Wetted radius (mm)' : 'Wetted length (mm)' }, type: 'linear', range: [0, niceCeil(top * 1.15)] },
    shapes:
      eq === null
        ? []
        : [{ type: 'line', xref: 'paper', x0: 0, x1: 1, y0: eq * 1000, y1: eq * 1000, line: { dash: 'dot', width: 1, color: '#888' } }],
  };
}

/** Liquid taken up (g) and uptake rate (g/s) against time. */
export function massTraces(r: VariantResultsOk): PlotTrace[] {
  if (!r.curves.mass || !r.curves.massRate) return [];
  const g = (xs: readonly (number | null)[]) => xs.map((x) => (x === null ? null : x * 1000));
  // The rate falls towards zero as the front levels off; on the log axis its last round-off values would
  // stretch the scale over twenty decades, so rates below 1/10,000 of the peak are left undrawn.
  const peak = Math.max(0, ...r.curves.massRate.map((x) => x ?? 0));
  const rate = r.curves.massRate.map((x) => (x === null || !(x >= peak * 1e-4) ? null : x * 1000));
  return [
    { x: r.curves.time, y: g(r.curves.mass), type: 'scatter', mode: 'lines', line: { color: PALETTE[0], width: 2 }, name: 'Uptake (g)' },
    { x: r.curves.time, y: rate, type: 'scatter', mode: 'lines', line: { color: PALETTE[1], width: 1.5 }, name: 'Rate (g/s)', yaxis: 'y2' },
  ];
}

export const MASS_LAYOUT: PlotLayout = {
  // Room on the right for the rate axis's labels (the chart's default margin there is for no axis).
  margin: { l: 64, r: 72, t: 16, b: 48 },
  xaxis: { title: { text: 'Time (s)' } },
  yaxis: { title: { text: 'Uptake (g)' }, rangemode: 'tozero' },
  yaxis2: { title: { text: 'Rate (g/s)' }, overlaying: 'y', side: 'right', type: 'log', exponentformat: 'power', dtick: 1 },
};

/** Equilibrium saturation against height (capillary bundle of the pore-size distribution), as steps. */
export function psdTraces(r: VariantResultsOk): PlotTrace[] {
  const p = r.poreSizeProfile;
  if (!p) return [];
  const x = [p.saturation[0], ...p.saturation, 0];
  const y = [0, ...p.height.map((h) => h * 1000), p.height[p.height.length - 1] * 1000];
  return [{ x, y, type: 'scatter', mode: 'lines', line: { shape: 'vh', color: PALETTE[0], width: 2 }, name: 'Saturation' }];
}

export const PSD_LAYOUT: PlotLayout = {
  xaxis: { title: { text: 'Saturation' }, range: [0, 1.05] },
  yaxis: { title: { text: 'Height above the liquid (mm)' }, rangemode: 'tozero' },
};

/** Tornado: the output at each input's low and high end, sorted by swing (largest on top). */
export function tornadoTraces(r: VariantResultsOk): PlotTrace[] {
  const t = r.tornado;
  if (!t) return [];
  const bars = [...t.bars].reverse();
  const base = t.base * 1000;
  const delta = (y: number | null) => (y === null ? 0 : y * 1000 - base);
  return [
    { type: 'bar', orientation: 'h', y: bars.map((b) => b.label), x: bars.map((b) => delta(b.outputLow)), base, name: 'Input at P10', marker: { color: PALETTE[5] } },
    { type: 'bar', orientation: 'h', y: bars.map((b) => b.label), x: bars.map((b) => delta(b.outputHigh)), base, name: 'Input at P90', marker: { color: PALETTE[1] } },
  ];
}

export function tornadoLayout(r: VariantResultsOk): PlotLayout {
  return {
    barmode: 'overlay',
    xaxis: { title: { text: `${r.tornado?.output ?? ''} (mm)` } },
    yaxis: { automargin: true },
    margin: { l: 160, r: 16, t: 16, b: 48 },
  };
}

/** Compare: every variant's curve on one chart. */
export function overlayTraces(variants: readonly CompareVariant[]): PlotTrace[] {
  return variants
    .filter((v) => v.curve !== null)
    .map((v, i) => ({
      x: v.curve!.time,
      y: mm(v.curve!.height),
      type: 'scatter',
      mode: 'lines',
      line: { color: PALETTE[i % PALETTE.length], width: 2, dash: v.usesUnapproved ? 'dot' : 'solid' },
      name: `${v.name}${v.usesUnapproved ? ' (unapproved material)' : ''}`,
    }));
}

/** Compare: each layered stack's liquid taken in (solid) and standing on the surface (dashed) against time, in mL. */
export function uptakeOverlayTraces(variants: readonly CompareVariant[]): PlotTrace[] {
  const ml = (v: readonly number[]) => v.map((x) => x * 1e6);
  return variants
    .filter((v) => v.uptake)
    .flatMap((v, i) => {
      const color = PALETTE[i % PALETTE.length];
      const label = `${v.name}${v.usesUnapproved ? ' (unapproved material)' : ''}`;
      return [
        { x: v.uptake!.time.map((t) => t / 60), y: ml(v.uptake!.absorbed), type: 'scatter', mode: 'lines', line: { color, width: 2 }, name: `${label}: absorbed` },
        { x: v.uptake!.time.map((t) => t / 60), y: ml(v.uptake!.surfaceLiquid), type: 'scatter', mode: 'lines', line: { color, width: 1.5, dash: 'dash' }, name: `${label}: on the surface` },
      ];
    });
}

export const UPTAKE_OVERLAY_LAYOUT: PlotLayout = {
  xaxis: { title: { text: 'Time (min)' } },
  yaxis: { title: { text: 'Liquid (mL)' }, rangemode: 'tozero' },
};

export const OVERLAY_LAYOUT: PlotLayout = {
  xaxis: { title: { text: 'Time (s)' } },
  yaxis: { title: { text: 'Wetted length or radius (mm)' }, rangemode: 'tozero' },
};
