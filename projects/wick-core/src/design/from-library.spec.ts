import type { FibreData, LiquidData, WebData } from '../api/library';
import { evaluateVariant } from './evaluate';
import { liquidFromLibrary, structureFromLibrary, type LibraryFibre } from './from-library';

const pv = (si: number, unit = '1') => ({ si, unit, source: 'measured' as const });
const deg = (d: number) => (d * Math.PI) / 180;

const PET: LibraryFibre = {
  id: 1,
  name: 'PET 6.7 dtex',
  data: { polymer: 'PET', density: pv(1390), linearDensity: pv(6.7e-7), contactAngles: [{ liquid: 'Water', angle: pv(deg(60)), method: 'Wilhelmy' }] } as FibreData,
};
const BICO: LibraryFibre = {
  id: 2,
  name: 'PE/PP bico 2.2 dtex',
  data: { polymer: 'PE/PP', density: pv(930), linearDensity: pv(2.2e-7), contactAngles: [{ liquid: 'water', angle: pv(deg(70)), method: 'Wilhelmy' }] } as FibreData,
};

function web(blend: WebData['blend']): WebData {
  return {
    webKind: 'carded-through-air-bonded',
    blend,
    basisWeight: pv(0.04),
    thickness: pv(0.0009),
    thicknessPressure: pv(500),
    porosityMode: 'computed',
    permeabilityInPlane: { mode: 'correlation', correlation: 'happel' },
    curves: [],
  };
}

describe('structureFromLibrary and liquidFromLibrary', () => {
  it('a single-fibre web keeps the fibre as it is and takes its contact angle for the liquid', () => {
    const { structure, notes } = structureFromLibrary(
      { kind: 'web', id: 9, revision: 3, name: 'ADL 40', state: 'approved', data: web([{ fibreId: 1, fibreName: 'PET', massFraction: 1 }]) },
      [PET, BICO],
      'water',
    );
    expect(structure.linearDensity).toBe(6.7e-7);
    expect(structure.fibreDensity).toBe(1390);
    expect(structure.contactAngle).toBe(deg(60));
    expect(structure.sources!['thickness']).toContain('500 Pa');
    // In-plane flow in a web runs across its fibres: Happel's cell model across the fibres.
    expect(structure.permeability).toEqual({ mode: 'correlation', correlation: 'happel-across' });
    expect(notes).toEqual([]);
  });

  it('a blend becomes one fibre of the blend density 1/ρf = Σ wᵢ/ρᵢ (exact volume balance)', () => {
    const { structure } = structureFromLibrary(
      {
        kind: 'web',
        id: 9,
        revision: 1,
        name: 'ADL blend',
        state: 'draft',
        data: web([
          { fibreId: 1, fibreName: 'PET', massFraction: 0.6 },
          { fibreId: 2, fibreName: 'bico', massFraction: 0.4 },
        ]),
      },
      [PET, BICO],
      'Water',
    );
    expect(structure.fibreDensity).toBeCloseTo(1 / (0.6 / 1390 + 0.4 / 930), 9);
    // The larger share (PET) gives the contact angle.
    expect(structure.contactAngle).toBe(deg(60));
    const r = evaluateVariant({
      configuration: 'vertical-strip',
      structure: { ...structure, contactAngle: structure.contactAngle! },
      liquid: { ref: 'water', temperature: 293.15 },
      dimensions: { width: 0.025, duration: 60 },
      checkpoints: { heights: [0.01], times: [60] },
    });
    expect(r.status).toBe('ok');
  });

  it('falls back to the Tomadakis–Robertson in-plane correlation for a name wick-core does not know, and says so', () => {
    const data = { ...web([{ fibreId: 1, fibreName: 'PET', massFraction: 1 }]), permeabilityInPlane: { mode: 'correlation', correlation: 'legacy-x' } } as unknown as WebData;
    const { structure, notes } = structureFromLibrary({ kind: 'web', id: 9, revision: 1, name: 'Old', state: 'approved', data }, [PET], 'water');
    expect(structure.permeability).toEqual({ mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' });
    expect(notes.some((n) => n.includes('legacy-x'))).toBeTrue();
  });

  it('refuses a blend fibre that is not in the library', () => {
    expect(() =>
      structureFromLibrary(
        { kind: 'web', id: 9, revision: 1, name: 'X', state: 'draft', data: web([{ fibreId: 77, fibreName: 'ghost', massFraction: 1 }]) },
        [PET],
        'water',
      ),
    ).toThrowError(/ghost/);
  });

  it('a library liquid with a table keeps the table and its sources', () => {
    const data: LiquidData = {
      surfaceTension: { mode: 'table', unit: 'mN/m', temperatureUnit: 'degC', source: 'measured', points: [{ temperature: 283.15, value: 0.071 }, { temperature: 303.15, value: 0.069 }] },
      viscosity: { mode: 'constant', value: pv(0.00105), temperature: pv(293.15) },
      density: { mode: 'constant', value: pv(1005), temperature: pv(293.15) },
      flammable: false,
    };
    const def = liquidFromLibrary({ kind: 'liquid', id: 4, revision: 2, name: 'Test saline B', state: 'approved', data });
    expect(def.surfaceTension).toEqual([{ temperature: 283.15, value: 0.071 }, { temperature: 303.15, value: 0.069 }]);
    expect(def.viscosity).toBe(0.00105);
    expect(def.sources!.viscosity).toContain('20.0 °C');
  });
});

describe('structureFromLibrary for an aqueous liquid', () => {
  it('uses the water contact angle for saline only when told the liquid is aqueous, and says so', () => {
    const pin = { kind: 'web' as const, id: 9, revision: 1, name: 'ADL', state: 'approved', data: web([{ fibreId: 1, fibreName: 'PET', massFraction: 1 }]) };
    expect(structureFromLibrary(pin, [PET], '0.9 % NaCl saline').structure.contactAngle).toBeUndefined();
    const { structure, notes } = structureFromLibrary(pin, [PET], '0.9 % NaCl saline', { aqueous: true });
    expect(structure.contactAngle).toBe(deg(60));
    expect(notes.some((n) => n.includes('aqueous'))).toBeTrue();
  });
});
