import { evaluateStackVariant, STACK_VARIANT_EXAMPLE, type StackVariantResults } from 'wick-core';
import { frontLayout, heatMapLayout, heatMapTraces, timeAxis, volumeTraces } from './stack-plots';

let results: StackVariantResults;

describe('stack plots', () => {
  beforeAll(() => (results = evaluateStackVariant({ ...STACK_VARIANT_EXAMPLE, cells: 60 })));

  it('draws saturation with time across and depth (mm) down, one column per snapshot', () => {
    const [t] = heatMapTraces(results);
    expect(t['type']).toBe('heatmap');
    expect(t['transpose']).toBeTrue();
    expect((t['x'] as number[]).length).toBe(results.heatMap.times.length);
    expect((t['y'] as number[])[0]).toBeCloseTo(results.heatMap.depth[0] * 1000, 12);
    expect(t['z']).toBe(results.heatMap.saturation);
    const layout = heatMapLayout(results);
    expect((layout['yaxis'] as { autorange: string }).autorange).toBe('reversed');
    // One line between each pair of layers, one label per layer.
    expect((layout['shapes'] as unknown[]).length).toBe(results.layers.length - 1);
    expect((layout['annotations'] as unknown[]).length).toBe(results.layers.length);
  });

  it('reads fifteen minutes in minutes and volumes in mL', () => {
    expect(timeAxis(results)).toEqual({ scale: 1 / 60, title: 'Time (min)' });
    const supplied = volumeTraces(results)[0]['y'] as number[];
    // Three 15 mL gushes: 45 mL supplied by the end.
    expect(supplied[supplied.length - 1]).toBeCloseTo(45, 9);
    const front = frontLayout(results);
    expect((front['yaxis'] as { range: number[] }).range[0]).toBeCloseTo(results.heatMap.boundaries[3] * 1000, 9);
  });
});
