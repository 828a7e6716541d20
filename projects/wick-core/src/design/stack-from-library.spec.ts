import type { FibreData, WebData } from '../api/library';
import type { LibraryFibre } from './from-library';
import { evaluateStackVariant } from './stack-evaluate';
import { stackLayerFromLibrary } from './stack-from-library';
import type { StackLayerInputs } from './stack-variant';

const pv = (si: number, unit = '1') => ({ si, unit, source: 'measured' as const });
const deg = (d: number) => (d * Math.PI) / 180;

const PP: LibraryFibre = {
  id: 4,
  name: 'PP 1.7 dtex, hydrophilic',
  data: { polymer: 'PP', density: pv(910), linearDensity: pv(1.7e-7), contactAngles: [{ liquid: 'water', angle: pv(deg(50)), method: 'Wilhelmy' }] } as FibreData,
};

function web(over: Partial<WebData> = {}): WebData {
  return {
    webKind: 'spunbond',
    blend: [{ fibreId: 4, fibreName: 'PP', massFraction: 1 }],
    basisWeight: pv(0.012),
    thickness: pv(0.25e-3),
    thicknessPressure: pv(500),
    porosityMode: 'computed',
    permeabilityInPlane: { mode: 'measured', value: pv(9e-11, 'm^2') },
    curves: [],
    ...over,
  };
}

const pinned = (data: WebData) => ({ kind: 'web' as const, id: 7, revision: 2, name: 'SB-12 topsheet', state: 'approved', data });

describe('stackLayerFromLibrary', () => {
  it('takes the measured through-plane permeability, not the in-plane one, and keeps the pin', () => {
    const { layer } = stackLayerFromLibrary(
      pinned(web({ permeabilityThroughPlane: { mode: 'measured', value: pv(5e-11, 'm^2') } })),
      [PP],
      'water',
    );
    expect(layer.structure.permeability).toEqual({ mode: 'measured', value: 5e-11 });
    expect(layer.structure.web).toEqual({ kind: 'web', id: 7, revision: 2, name: 'SB-12 topsheet', state: 'approved' });
    expect(layer.structure.sources!['permeability']).toMatch(/^through-plane/);
    expect(layer.structure.contactAngle).toBe(deg(50));
  });

  it('falls back to the through-plane correlation, and says so, when the web has no through-plane permeability', () => {
    const { layer, notes } = stackLayerFromLibrary(pinned(web()), [PP], 'water');
    expect(layer.structure.permeability).toEqual({ mode: 'correlation', correlation: 'tomadakis-robertson-2d-through-plane' });
    expect(notes.some((n) => n.includes('through-plane correlation'))).toBeTrue();
    expect(notes.some((n) => n.includes('in-plane'))).toBeFalse();
  });

  it('maps a library correlation (Happel, flow across the fibres through the plane)', () => {
    const { layer } = stackLayerFromLibrary(pinned(web({ permeabilityThroughPlane: { mode: 'correlation', correlation: 'happel' } })), [PP], 'water');
    expect(layer.structure.permeability).toEqual({ mode: 'correlation', correlation: 'happel-across' });
  });

  it('derives the retention curve from the pore-size distribution when there is one, and asks otherwise', () => {
    const psd = {
      form: 'differential' as const,
      diameterUnit: 'um',
      diameters: [20e-6, 40e-6, 60e-6, 90e-6, 130e-6],
      fractions: [0.1, 0.3, 0.3, 0.2, 0.1],
      source: 'measured' as const,
    };
    const withPsd = stackLayerFromLibrary(pinned(web({ poreSizeDistribution: psd })), [PP], 'water');
    expect(withPsd.layer.retention).toEqual({ mode: 'pore-size' });
    const without = stackLayerFromLibrary(pinned(web()), [PP], 'water');
    expect(without.layer.retention).toBeUndefined();
    expect(without.notes.some((n) => n.includes('no pore-size distribution'))).toBeTrue();

    // The mapped layer runs as it is: porosity from basis weight ε = 1 − BW/(ρf t) (mass balance).
    const layer = withPsd.layer as StackLayerInputs;
    const r = evaluateStackVariant({
      configuration: 'stack',
      layers: [layer, { ...layer, name: 'second', structure: { ...layer.structure, thickness: 3e-3, basisWeight: 0.15 } }],
      liquid: { ref: 'water', temperature: 296.15 },
      insult: { volume: 2e-6, rate: 1e-6, area: 10e-4, count: 1 },
      duration: 30,
      cells: 60,
    });
    expect(r.layers[0].porosity).toBeCloseTo(1 - 0.012 / (910 * 0.25e-3), 12);
    expect(r.layers[0].retention.mode).toBe('pore-size');
    expect(r.layers[0].retention.n!).toBeGreaterThan(1);
    expect(r.layers[0].web!.revision).toBe(2);
  });
});
