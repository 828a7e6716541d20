import type { Express } from 'express';
import { parse } from 'csv-parse/sync';
import {
  DEFAULT_STACK_OPTIONS,
  evaluateStackVariant,
  STACK_VARIANT_EXAMPLE,
  type CompareResponse,
  type DesignSummary,
  type StackVariantInputs,
  type StackVariantResults,
  type VariantReport,
  type WebData,
} from 'wick-core';
import { libraryModels } from '../models/library';
import { pv, uniqueName } from '../../test/library';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';

/** A saved stack as the server answers it (the wire type still names the single-layer inputs). */
interface SavedStack {
  id: number;
  version: number;
  inputs: StackVariantInputs;
  options: typeof DEFAULT_STACK_OPTIONS;
  results: StackVariantResults;
  materials: { id: number; revision: number; approved: boolean; newerApprovedRevision: number | null }[];
  usesUnapproved: boolean;
}

/** An invented airlaid core web with a pore-size distribution and a measured through-plane permeability. */
const coreWeb = (basisWeight: number, fibreId: number): WebData => ({
  webKind: 'airlaid',
  blend: [{ fibreId, fibreName: 'Fluff pulp', massFraction: 1 }],
  basisWeight: pv(basisWeight, 'g/m^2'),
  thickness: pv(0.006, 'mm'),
  thicknessPressure: pv(500, 'Pa'),
  porosityMode: 'measured',
  porosity: pv(0.95, '%'),
  permeabilityThroughPlane: { mode: 'measured', value: pv(2e-11, 'm^2') },
  poreSizeDistribution: {
    form: 'differential',
    diameterUnit: 'um',
    diameters: [20e-6, 40e-6, 60e-6, 90e-6, 130e-6, 180e-6, 250e-6],
    fractions: [0.05, 0.15, 0.25, 0.25, 0.15, 0.1, 0.05],
    source: 'measured',
  },
  curves: [],
});

describe('design workspace routes: stack variants', () => {
  let app: Express;
  let engineer: Agent;
  let engineerId: number;
  let designId: number;

  beforeAll(async () => {
    app = testApp();
    engineer = (await signInAs(app, 'engineer')).agent;
    engineerId = (await engineer.get('/api/me').expect(200)).body.id;
    const project = await engineer.post('/api/projects').send({ name: uniqueName('Stack project'), description: 'stack spec' }).expect(201);
    designId = (await engineer.post(`/api/projects/${project.body.id}/designs`).send({ name: 'Night pad stacks' }).expect(201)).body.id;
  });

  it('when a stack is saved, then the server runs the same evaluator as the browser and stores its results', async () => {
    const saved = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'Three gushes', inputs: STACK_VARIANT_EXAMPLE }).expect(201))
      .body as SavedStack;
    expect(saved.inputs.configuration).toBe('stack');
    expect(saved.options).toEqual({ ...DEFAULT_STACK_OPTIONS });
    // The Web Worker calls evaluateStackVariant with the same options: identical numbers after JSONB.
    const browser = evaluateStackVariant(STACK_VARIANT_EXAMPLE, DEFAULT_STACK_OPTIONS);
    const read = (await engineer.get(`/api/variants/${saved.id}`).expect(200)).body as SavedStack;
    expect(read.results).toEqual(JSON.parse(JSON.stringify(browser)));
    expect(read.results.massBalance.relativeError).toBeLessThan(1e-6);

    const design = (await engineer.get(`/api/designs/${designId}`).expect(200)).body as DesignSummary;
    const listed = design.variants.find((v) => v.id === saved.id)!;
    // The last of the three gushes tells constructions apart, so the list shows that one.
    expect(listed.headline.map((f) => f.key).sort()).toEqual(['acquisition@3', 'capacityUsed', 'rewetIndicator']);
  });

  it('when stack inputs are invalid, then the answer names the field', async () => {
    const bad = { ...STACK_VARIANT_EXAMPLE, insult: { ...STACK_VARIANT_EXAMPLE.insult, interval: 1 } };
    const res = await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'Overlapping gushes', inputs: bad }).expect(422);
    expect(res.body.error.details.field).toBe('insult.interval');
  });

  it('when a stack pins a draft web, then it is marked unapproved; re-running with repin takes the newer approved revision', async () => {
    const { Entry, Revision } = libraryModels(testSequelize());
    const fibre = await Entry.create({ kind: 'fibre', createdBy: engineerId, headRevisionId: null, approvedRevisionId: null });
    const fibreData = { polymer: 'cellulose', density: pv(1500, 'kg/m^3'), diameter: pv(30e-6, 'um'), contactAngles: [] };
    const f1 = await Revision.create({ entryId: fibre.id, number: 1, state: 'approved', name: uniqueName('Spec pulp'), supplierId: null, data: fibreData, createdBy: engineerId, updatedBy: engineerId });
    await fibre.update({ headRevisionId: f1.id, approvedRevisionId: f1.id });
    const entry = await Entry.create({ kind: 'web', createdBy: engineerId, headRevisionId: null, approvedRevisionId: null });
    const name = uniqueName('Spec airlaid core');
    await Revision.create({ entryId: entry.id, number: 1, state: 'draft', name, supplierId: null, data: coreWeb(0.3, fibre.id), createdBy: engineerId, updatedBy: engineerId });
    const core = STACK_VARIANT_EXAMPLE.layers[2];
    const inputs: StackVariantInputs = {
      ...STACK_VARIANT_EXAMPLE,
      layers: [
        ...STACK_VARIANT_EXAMPLE.layers.slice(0, 2),
        { ...core, structure: { ...core.structure, porosity: 0.95, web: { kind: 'web', id: entry.id, revision: 1, name: 'client says', state: 'approved' } } },
      ],
    };
    const v = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'Pinned core', inputs }).expect(201)).body as SavedStack;
    // The library's state wins over the client's claim.
    expect(v.usesUnapproved).toBeTrue();
    expect(v.inputs.layers[2].structure.web!.state).toBe('draft');
    expect(v.materials.map((m) => [m.id, m.revision, m.approved])).toEqual([[entry.id, 1, false]]);

    const r2 = await Revision.create({ entryId: entry.id, number: 2, state: 'approved', name, supplierId: null, data: coreWeb(0.35, fibre.id), createdBy: engineerId, updatedBy: engineerId });
    await entry.update({ headRevisionId: r2.id, approvedRevisionId: r2.id });
    const before = (await engineer.get(`/api/variants/${v.id}`).expect(200)).body as SavedStack;
    expect(before.materials[0].newerApprovedRevision).toBe(2);

    const rerun = (await engineer.post(`/api/variants/${v.id}/rerun`).send({ version: before.version, repin: true }).expect(200)).body as SavedStack;
    const layer = rerun.inputs.layers[2];
    expect(layer.name).toBe('Core');
    expect(layer.structure.web!.revision).toBe(2);
    expect(layer.structure.basisWeight).toBe(0.35);
    // Through-plane permeability from the library, the retention choice kept.
    expect(layer.structure.permeability).toEqual({ mode: 'measured', value: 2e-11 });
    expect(layer.retention).toEqual({ mode: 'pore-size' });
    expect(rerun.usesUnapproved).toBeFalse();
    expect(rerun.results.layers[2].web!.revision).toBe(2);
  });

  it('when a stack and a layer variant are compared, then each brings its own key figures; exports and reports list the layers', async () => {
    const stack = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'Compared stack', inputs: STACK_VARIANT_EXAMPLE }).expect(201)).body as SavedStack;
    const thinner = {
      ...STACK_VARIANT_EXAMPLE,
      insult: { ...STACK_VARIANT_EXAMPLE.insult, volume: 10e-6 },
    };
    const other = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'Smaller gushes', inputs: thinner }).expect(201)).body as SavedStack;
    const layer = await engineer
      .post(`/api/designs/${designId}/variants`)
      .send({
        name: 'Core as a strip',
        inputs: {
          configuration: 'vertical-strip',
          structure: STACK_VARIANT_EXAMPLE.layers[2].structure,
          liquid: STACK_VARIANT_EXAMPLE.liquid,
          dimensions: { width: 0.025, duration: 600 },
          checkpoints: { heights: [0.01], times: [60] },
        },
      })
      .expect(201);
    const c = (await engineer.get(`/api/compare?variants=${stack.id},${other.id},${layer.body.id}&baseline=${stack.id}`).expect(200)).body as CompareResponse;
    const used = c.figures.find((f) => f.key === 'capacityUsed')!;
    expect(used.values.map((x) => x.variantId)).toEqual([stack.id, other.id, layer.body.id]);
    expect(used.values[2].value).toBeNull();
    expect(used.values[1].best).toBeTrue();
    expect(c.figures.some((f) => f.key === 'equilibriumHeight')).toBeTrue();
    expect(c.variants[0].curve).toBeNull();
    // A stack brings its uptake instead: absorbed volume ends at the run's total, a layer variant brings none.
    expect(c.variants[0].uptake!.time.length).toBe(DEFAULT_STACK_OPTIONS.snapshots);
    expect(c.variants[0].uptake!.absorbed.at(-1)).toBeGreaterThan(0);
    expect(c.variants[2].uptake).toBeNull();

    const csv = await engineer.get(`/api/variants/${stack.id}/export.csv?what=summary`).expect(200);
    const rows = parse(csv.text) as string[][];
    expect(rows.some((r) => r[0] === 'input' && r[1] === 'Core: Thickness' && Number(r[2]) === 0.006)).toBeTrue();
    expect(rows.some((r) => r[0] === 'result' && r[1] === 'Acquisition time, gush 1')).toBeTrue();
    const curve = parse((await engineer.get(`/api/variants/${stack.id}/export.csv?what=curve`).expect(200)).text) as string[][];
    expect(curve[0]).toEqual(['time_s', 'supplied_m3', 'absorbed_m3', 'surface_liquid_m3', 'front_depth_m']);
    expect(curve.length).toBe(1 + DEFAULT_STACK_OPTIONS.snapshots);

    const report = (await engineer.get(`/api/variants/${stack.id}/report`).expect(200)).body as VariantReport;
    expect(report.inputRows.some((r) => r.path === 'layers[0].structure.thickness')).toBeTrue();
    expect(report.keyFigures[0].key).toBe('acquisition@1');
  });
  it('when a stack overflows, then its unreached gushes read "not reached" in the comparison and in the CSV', async () => {
    // 3 × 60 mL into 80 cm² is more than the example stack's pore volume there: the later gushes stay standing.
    const flooded = { ...STACK_VARIANT_EXAMPLE, insult: { ...STACK_VARIANT_EXAMPLE.insult, volume: 60e-6, rate: 10e-6 } };
    const a = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'Flooded stack', inputs: flooded }).expect(201)).body as SavedStack;
    const b = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'Reference stack', inputs: STACK_VARIANT_EXAMPLE }).expect(201)).body as SavedStack;
    const c = (await engineer.get(`/api/compare?variants=${a.id},${b.id}&baseline=${b.id}`).expect(200)).body as CompareResponse;
    const third = c.figures.find((f) => f.key === 'acquisition@3')!;
    expect(third.values[0].value).toBeNull();
    expect(third.values[0].note).toBe('not reached');
    expect(third.values[1].value).not.toBeNull();
    // A reached gush beats one that never is.
    expect(third.values[1].best).toBeTrue();
    const rows = parse((await engineer.get(`/api/variants/${a.id}/export.csv?what=summary`).expect(200)).text) as string[][];
    expect(rows.find((r) => r[0] === 'result' && r[1] === 'Acquisition time, gush 3')?.[2]).toBe('not reached');
    // The design's list keeps the unreached gush in the headline, saying so.
    const design = (await engineer.get(`/api/designs/${designId}`).expect(200)).body as DesignSummary;
    const last = design.variants.find((v) => v.id === a.id)!.headline.find((f) => f.key === 'acquisition@3')!;
    expect([last.value, last.nullMeans]).toEqual([null, 'not reached']);
  });
});
