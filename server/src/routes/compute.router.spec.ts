import type { Express } from 'express';
import { evaluateVariant, runModel, type BatchComputeResponse, type ComputeResponse, type ModelDescription, type VariantFixture } from 'wick-core';
import fixtureJson from '../../../projects/wick-core/src/design/fixture/variants.json';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp } from '../../test/test-app';

const fixture = fixtureJson as unknown as VariantFixture;

describe('compute routes', () => {
  let app: Express;
  let reviewer: Agent;

  beforeAll(async () => {
    app = testApp();
    reviewer = (await signInAs(app, 'reviewer')).agent;
  });

  it('when the models are listed, then every registered model is there, the design variant among them', async () => {
    const models = (await reviewer.get('/api/compute/models').expect(200)).body as ModelDescription[];
    expect(models.map((m) => m.id)).toContain('washburn-porous-strip');
    expect(models.map((m) => m.id)).toContain('design-variant');
    expect(models.every((m) => !('run' in m))).toBeTrue();
  });

  it('when one model runs, then the answer is what the CLI’s runModel gives for the same request', async () => {
    const request = { model: 'washburn-capillary', inputs: { radius: '0.3 mm', surfaceTension: 73, viscosity: 1, contactAngle: 0, density: 1000 } };
    const res = (await reviewer.post('/api/compute').send(request).expect(200)).body as ComputeResponse;
    expect(res).toEqual(JSON.parse(JSON.stringify(runModel(request))));
    expect(res.ok).toBeTrue();
  });

  it('when a model refuses its inputs, then ok: false names the field', async () => {
    const res = (await reviewer.post('/api/compute').send({ model: 'washburn-capillary', inputs: { radius: -1, surfaceTension: 73, viscosity: 1, contactAngle: 0, density: 1000 } }).expect(200)).body as ComputeResponse;
    expect(res.ok).toBeFalse();
    if (!res.ok) expect(res.error.field).toBe('radius');
    await reviewer.post('/api/compute').send({ inputs: {} }).expect(422);
  });

  it('when fixture variants are batched, then each result equals evaluateVariant’s, in order', async () => {
    const requests = fixture.cases.map((c) => ({ model: 'design-variant', inputs: { variant: c.inputs, ...c.options } }));
    const res = (await reviewer.post('/api/compute/batch').send({ requests }).expect(200)).body as BatchComputeResponse;
    expect(res.results.length).toBe(fixture.cases.length);
    res.results.forEach((r, i) => {
      expect(r.ok).toBeTrue();
      if (r.ok) expect(r.result).toEqual(JSON.parse(JSON.stringify(evaluateVariant(fixture.cases[i].inputs, fixture.cases[i].options))));
    });
  });

  it('when a batch is empty or too big, then 422', async () => {
    await reviewer.post('/api/compute/batch').send({ requests: [] }).expect(422);
    const many = Array.from({ length: 501 }, () => ({ model: 'units-convert', inputs: {} }));
    await reviewer.post('/api/compute/batch').send({ requests: many }).expect(422);
  });
});
