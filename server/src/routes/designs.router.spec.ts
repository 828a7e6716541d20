import type { Express } from 'express';
import { parse } from 'csv-parse/sync';
import {
  evaluateVariant,
  fixtureKeys,
  fixtureMismatches,
  type ProjectDetail,
  type VariantDetail,
  type VariantFixture,
  type VariantInputs,
  type VariantReport,
  type WebData,
} from 'wick-core';
import fixtureJson from '../../../projects/wick-core/src/design/fixture/variants.json';
import { designModels } from '../models';
import { libraryModels } from '../models/library';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';

const fixture = fixtureJson as unknown as VariantFixture;
const deg = (d: number) => (d * Math.PI) / 180;

/** An ad-hoc vertical strip (invented values). */
function stripInputs(thickness = 0.001): VariantInputs {
  return {
    configuration: 'vertical-strip',
    structure: {
      fibreDiameter: 20e-6,
      fibreDensity: 1390,
      basisWeight: 0.05,
      thickness,
      contactAngle: deg(50),
      permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
    },
    liquid: { ref: 'water', temperature: 293.15 },
    dimensions: { width: 0.025, duration: 600 },
    checkpoints: { heights: [0.01, 0.02], times: [60, 600] },
  };
}

const web = (basisWeight: number): WebData => ({
  webKind: 'carded-through-air-bonded',
  blend: [{ fibreId: undefined, fibreName: 'none', massFraction: 1 }],
  basisWeight: { si: basisWeight, unit: 'g/m^2', source: 'measured' },
  thickness: { si: 0.001, unit: 'mm', source: 'measured' },
  thicknessPressure: { si: 500, unit: 'Pa', source: 'measured' },
  porosityMode: 'computed',
  curves: [],
});

describe('design workspace routes', () => {
  let app: Express;
  let engineer: Agent;
  let manager: Agent;
  let engineerId: number;
  let projectId: number;
  let designId: number;

  beforeAll(async () => {
    app = testApp();
    engineer = (await signInAs(app, 'engineer')).agent;
    manager = (await signInAs(app, 'program-manager')).agent;
    engineerId = (await engineer.get('/api/me').expect(200)).body.id;
    const project = await engineer.post('/api/projects').send({ name: `Spec project ${Date.now()}`, description: 'routes spec' }).expect(201);
    projectId = project.body.id;
    designId = (await engineer.post(`/api/projects/${projectId}/designs`).send({ name: 'ADL options' }).expect(201)).body.id;
  });

  it('when each fixture case is saved, then the server’s stored results equal the shared fixture to round-off', async () => {
    for (const [i, c] of fixture.cases.entries()) {
      const saved = await engineer.post(`/api/designs/${designId}/variants`).send({ name: `fixture ${i}`, inputs: c.inputs }).expect(201);
      // Read back: the numbers went through PostgreSQL JSONB and must come out unchanged.
      const read = (await engineer.get(`/api/variants/${saved.body.id}`).expect(200)).body as VariantDetail;
      expect(read.options).toEqual(c.options as VariantDetail['options']);
      expect(fixtureMismatches(c.expected, fixtureKeys(read.results))).withContext(c.name).toEqual([]);
      expect(read.results).toEqual(saved.body.results);
    }
  });

  it('when a variant is saved, then it keeps its inputs, the wick-core version and the results wick-core gives', async () => {
    const inputs = stripInputs();
    const res = await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'plain strip', inputs }).expect(201);
    const v = res.body as VariantDetail;
    expect(v.inputs).toEqual(inputs);
    expect(v.coreVersion).toBe(v.currentCoreVersion);
    expect(v.results).toEqual(JSON.parse(JSON.stringify(evaluateVariant(inputs, v.options))));
    expect(v.usesUnapproved).toBeFalse();
    expect(v.version).toBe(1);
  });

  it('when inputs are physically invalid, then 422 names the field and nothing is saved', async () => {
    const before = await designModels(testSequelize()).Variant.count();
    const bad = stripInputs(0.00001); // 50 g/m² in 10 µm: denser than the fibre
    const res = await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'too dense', inputs: bad }).expect(422);
    expect(res.body.error.details.field).toBe('structure.thickness');
    expect(res.body.error.message).toContain('denser');
    const missing = await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'no width', inputs: { ...stripInputs(), dimensions: { duration: 60 } } }).expect(422);
    expect(missing.body.error.details.field).toBe('dimensions.width');
    await engineer.post(`/api/designs/${designId}/variants`).send({ name: '', inputs: stripInputs() }).expect(422);
    expect(await designModels(testSequelize()).Variant.count()).toBe(before);
  });

  it('when two people save the same version, then the second gets 409 and the first save stands', async () => {
    const v = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'locking', inputs: stripInputs() }).expect(201)).body as VariantDetail;
    const first = await engineer.put(`/api/variants/${v.id}`).send({ name: 'locking', inputs: stripInputs(0.0012), version: 1 }).expect(200);
    expect(first.body.version).toBe(2);
    const second = await engineer.put(`/api/variants/${v.id}`).send({ name: 'locking', inputs: stripInputs(0.0008), version: 1 }).expect(409);
    expect(second.body.error.code).toBe('stale');
    const read = (await engineer.get(`/api/variants/${v.id}`).expect(200)).body as VariantDetail;
    expect(read.inputs.structure!.thickness).toBe(0.0012);
  });

  it('when a variant pins a draft web, then it is marked unapproved; when a newer revision is approved, a re-run with repin moves to it', async () => {
    const { Entry, Revision } = libraryModels(testSequelize());
    const entry = await Entry.create({ kind: 'web', createdBy: engineerId, headRevisionId: null, approvedRevisionId: null });
    const r1 = await Revision.create({ entryId: entry.id, number: 1, state: 'draft', name: 'Spec ADL 50', supplierId: null, data: web(0.05), createdBy: engineerId, updatedBy: engineerId });
    const inputs = stripInputs();
    const pinned = { ...inputs, structure: { ...inputs.structure!, web: { kind: 'web' as const, id: entry.id, revision: 1, name: 'whatever the client says', state: 'approved' } } };
    const v = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'pinned draft', inputs: pinned }).expect(201)).body as VariantDetail;
    // The library's state wins over the client's claim.
    expect(v.inputs.structure!.web!.state).toBe('draft');
    expect(v.inputs.structure!.web!.name).toBe('Spec ADL 50');
    expect(v.usesUnapproved).toBeTrue();
    const project = (await manager.get(`/api/projects/${projectId}`).expect(200)).body as ProjectDetail;
    const listed = project.designs.flatMap((d) => d.variants).find((x) => x.id === v.id)!;
    expect(listed.usesUnapproved).toBeTrue();

    // Revision 1 approved, then revision 2 approved with a heavier web.
    await r1.update({ state: 'approved' });
    const r2 = await Revision.create({ entryId: entry.id, number: 2, state: 'approved', name: 'Spec ADL 60', supplierId: null, data: web(0.06), createdBy: engineerId, updatedBy: engineerId });
    await entry.update({ approvedRevisionId: r2.id, headRevisionId: r2.id });
    const reread = (await engineer.get(`/api/variants/${v.id}`).expect(200)).body as VariantDetail;
    expect(reread.usesUnapproved).toBeFalse();
    expect(reread.hasNewerMaterials).toBeTrue();
    expect(reread.materials[0].newerApprovedRevision).toBe(2);

    // The web has no library fibre: re-pinning it must fail cleanly, not half-apply.
    const failed = await engineer.post(`/api/variants/${v.id}/rerun`).send({ version: reread.version, repin: true });
    expect(failed.status).toBe(422);
    const plain = await engineer.post(`/api/variants/${v.id}/rerun`).send({ version: reread.version, repin: false }).expect(200);
    expect(plain.body.version).toBe(reread.version + 1);
    expect(plain.body.inputs.structure.web.revision).toBe(1);
  });

  it('when a variant is exported, then the CSV lists its inputs with sources, results, warnings and the safety note', async () => {
    const v = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'csv, "quoted" =name', inputs: stripInputs() }).expect(201)).body as VariantDetail;
    const res = await manager.get(`/api/variants/${v.id}/export.csv`).expect(200);
    expect(res.headers['content-type']).toContain('text/csv');
    expect(res.headers['content-disposition']).toContain('attachment');
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.find((r) => r['name'] === 'Name')!['value']).toBe('csv, "quoted" =name');
    const thickness = rows.find((r) => r['section'] === 'input' && r['name'] === 'Thickness')!;
    expect(Number(thickness['value'])).toBe(0.001);
    expect(thickness['unit']).toBe('m');
    const eq = rows.find((r) => r['section'] === 'result' && r['name'] === 'Equilibrium height')!;
    expect(Number(eq['value'])).toBe((v.results as { equilibriumHeight: number }).equilibriumHeight);
    expect(rows.some((r) => r['section'] === 'note' && r['value'].includes('engineering estimate'))).toBeTrue();
    const curve = parse((await manager.get(`/api/variants/${v.id}/export.csv?what=curve`).expect(200)).text, { columns: true }) as Record<string, string>[];
    expect(curve.length).toBe(v.options.curvePoints);
    expect(Number(curve[curve.length - 1]['time_s'])).toBe(600);
  });

  it('when the report is fetched, then it carries inputs with sources, equations, warnings and the safety note, and the export is audited', async () => {
    const v = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'report me', inputs: stripInputs() }).expect(201)).body as VariantDetail;
    const report = (await manager.get(`/api/variants/${v.id}/report`).expect(200)).body as VariantReport;
    expect(report.inputRows.find((r) => r.path === 'liquid.surfaceTension')!.source).toContain('IAPWS');
    expect(report.equations.map((e) => e.id)).toContain('washburn-porous-strip');
    expect(report.safetyNote).toContain('standard test methods');
    const { AuditLog } = (await import('../models')).authModels(testSequelize());
    const rows = await AuditLog.findAll({ where: { entityType: 'variant', entityId: String(v.id), action: 'export' } });
    expect(rows.length).toBe(1);
  });

  it('when a programme manager tries to change a variant, then 403; when anyone asks for a missing one, then 404', async () => {
    const v = (await engineer.post(`/api/designs/${designId}/variants`).send({ name: 'pm cannot edit', inputs: stripInputs() }).expect(201)).body as VariantDetail;
    await manager.put(`/api/variants/${v.id}`).send({ name: 'x', inputs: stripInputs(), version: 1 }).expect(403);
    await manager.get('/api/variants/987654').expect(404);
  });

  it('when a design is deleted, then its variants go with it and the deletion is audited', async () => {
    const d = (await engineer.post(`/api/projects/${projectId}/designs`).send({ name: 'to delete' }).expect(201)).body;
    const v = (await engineer.post(`/api/designs/${d.id}/variants`).send({ name: 'gone', inputs: stripInputs() }).expect(201)).body;
    await engineer.delete(`/api/designs/${d.id}`).expect(204);
    await engineer.get(`/api/variants/${v.id}`).expect(404);
    await engineer.post(`/api/projects/${projectId}/designs`).send({ name: 'ADL options' }).expect(409);
  });
});
