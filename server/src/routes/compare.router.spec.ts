import type { Express } from 'express';
import { parse } from 'csv-parse/sync';
import type { CompareResponse, ComparisonReport, DecisionRecord, ProjectDetail, VariantInputs } from 'wick-core';
import { authModels } from '../models';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';

const deg = (d: number) => (d * Math.PI) / 180;

function strip(thickness: number, contactAngle = 50): VariantInputs {
  return {
    configuration: 'vertical-strip',
    structure: {
      fibreDiameter: 20e-6,
      fibreDensity: 1390,
      basisWeight: 0.05,
      thickness,
      contactAngle: deg(contactAngle),
      permeability: { mode: 'correlation', correlation: 'tomadakis-robertson-2d-in-plane' },
    },
    liquid: { ref: 'saline-0.9', temperature: 296.15 },
    dimensions: { width: 0.025, duration: 600 },
    checkpoints: { heights: [0.01, 0.02], times: [60, 600] },
  };
}

describe('compare and decide routes', () => {
  let app: Express;
  let engineer: Agent;
  let manager: Agent;
  let projectId: number;
  let ids: number[];
  let otherProjectVariant: number;

  beforeAll(async () => {
    app = testApp();
    engineer = (await signInAs(app, 'engineer')).agent;
    manager = (await signInAs(app, 'program-manager')).agent;
    projectId = (await engineer.post('/api/projects').send({ name: `Compare spec ${Date.now()}` }).expect(201)).body.id;
    const designId = (await engineer.post(`/api/projects/${projectId}/designs`).send({ name: 'Core density' }).expect(201)).body.id;
    ids = [];
    for (const [name, inputs] of [
      ['thin', strip(0.0008)],
      ['thick', strip(0.0012)],
      ['well wetted', strip(0.001, 20)],
    ] as const) {
      ids.push((await engineer.post(`/api/designs/${designId}/variants`).send({ name, inputs }).expect(201)).body.id);
    }
    const other = (await engineer.post('/api/projects').send({ name: `Other ${Date.now()}` }).expect(201)).body.id;
    const otherDesign = (await engineer.post(`/api/projects/${other}/designs`).send({ name: 'x' }).expect(201)).body.id;
    otherProjectVariant = (await engineer.post(`/api/designs/${otherDesign}/variants`).send({ name: 'elsewhere', inputs: strip(0.001) }).expect(201)).body.id;
  });

  it('when three variants are compared against a baseline, then each figure has deltas against it and the best marked', async () => {
    const res = await manager.get(`/api/compare?variants=${ids.join(',')}&baseline=${ids[1]}`).expect(200);
    const c = res.body as CompareResponse;
    expect(c.baselineId).toBe(ids[1]);
    expect(c.variants.map((v) => v.id)).toEqual(ids);
    expect(c.variants.every((v) => v.curve !== null && v.curve.time.length > 10)).toBeTrue();
    const eq = c.figures.find((f) => f.key === 'equilibriumHeight')!;
    expect(eq.values.find((v) => v.variantId === ids[1])!.delta).toBe(0);
    // Pc = γ cos θ / r_h: the smaller contact angle (20°) gives the highest equilibrium height.
    expect(eq.values.filter((v) => v.best).map((v) => v.variantId)).toEqual([ids[2]]);
  });

  it('when the selection is too small, has a duplicate or a baseline outside it, then 422', async () => {
    await manager.get(`/api/compare?variants=${ids[0]}`).expect(422);
    await manager.get(`/api/compare?variants=${ids[0]},${ids[0]}`).expect(422);
    await manager.get(`/api/compare?variants=${ids[0]},${ids[1]}&baseline=${ids[2]}`).expect(422);
    await manager.get(`/api/compare?variants=${ids[0]},${ids[1]},999999`).expect(404);
    await manager.get('/api/compare?variants=1,2,3,4,5,6,7,8,9').expect(422);
  });

  it('when the programme manager records a decision, then it is stored with who and when, listed on the project and in the audit log', async () => {
    const res = await manager
      .post('/api/decisions')
      .send({ variantIds: ids, baselineVariantId: ids[1], chosenVariantId: ids[2], rationale: 'Fastest rise at 60 s with the same capacity.' })
      .expect(201);
    const d = res.body as DecisionRecord;
    expect(d.chosenVariantId).toBe(ids[2]);
    expect(d.chosenVariantName).toBe('well wetted');
    expect(d.decidedBy.name).toBe('Martin Kessler');
    expect(Date.now() - Date.parse(d.decidedAt)).toBeLessThan(60_000);
    const project = (await engineer.get(`/api/projects/${projectId}`).expect(200)).body as ProjectDetail;
    expect(project.decisions.map((x) => x.id)).toContain(d.id);
    const { AuditLog } = authModels(testSequelize());
    const audit = await AuditLog.findOne({ where: { entityType: 'decision', entityId: String(d.id) } });
    expect(audit?.action).toBe('create');
    expect(audit?.details?.['rationale']).toBe('Fastest rise at 60 s with the same capacity.');
    const again = (await manager.get(`/api/compare?variants=${ids.join(',')}`).expect(200)).body as CompareResponse;
    expect(again.decisions.map((x) => x.id)).toContain(d.id);
  });

  it('when an engineer tries to record a decision, then 403; when the choice is not compared or projects are mixed, then 422', async () => {
    await engineer.post('/api/decisions').send({ variantIds: ids, baselineVariantId: ids[0], chosenVariantId: ids[0], rationale: 'mine' }).expect(403);
    await manager.post('/api/decisions').send({ variantIds: ids.slice(0, 2), baselineVariantId: ids[0], chosenVariantId: ids[2], rationale: 'not compared' }).expect(422);
    const mixed = await manager
      .post('/api/decisions')
      .send({ variantIds: [ids[0], otherProjectVariant], baselineVariantId: ids[0], chosenVariantId: ids[0], rationale: 'mixed projects' })
      .expect(422);
    expect(mixed.body.error.code).toBe('mixed-projects');
    await manager.post('/api/decisions').send({ variantIds: ids, baselineVariantId: ids[0], chosenVariantId: ids[0], rationale: '' }).expect(422);
  });

  it('when the comparison is exported, then the CSV has a value, delta and best column per variant', async () => {
    const res = await manager.get(`/api/compare/export.csv?variants=${ids.join(',')}&baseline=${ids[0]}`).expect(200);
    expect(res.headers['content-disposition']).toContain('.csv');
    const rows = parse(res.text) as string[][];
    expect(rows[0].length).toBe(3 + 3 * ids.length);
    const eq = rows.find((r) => r[0] === 'Equilibrium height')!;
    expect(Number(eq[4])).toBe(0); // baseline delta
    const best = rows.find((r) => r[0] === 'Baseline')!;
    expect(best[3]).toBe('yes');
    expect(rows[rows.length - 1][0]).toBe('Safety note');
  });

  it('when the comparison report is fetched, then it has each variant’s report and the safety note', async () => {
    const r = (await manager.get(`/api/compare/report?variants=${ids.join(',')}`).expect(200)).body as ComparisonReport;
    expect(r.variants.length).toBe(3);
    expect(r.variants[0].inputRows.length).toBeGreaterThan(5);
    expect(r.safetyNote.length).toBeGreaterThan(20);
  });
});
