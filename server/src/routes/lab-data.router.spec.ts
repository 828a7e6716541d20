import type { Express } from 'express';
import { QueryTypes } from 'sequelize';
import {
  createRng,
  DEFAULT_VARIANT_OPTIONS,
  type EntryDetail,
  evaluateVariant,
  gravityHeight,
  type LabRunCreate,
  type LabRunDetail,
  type LabSetDetail,
  liquidAt,
  type PredictionCandidate,
  type PredictionComparison,
  type ContactAngleAnalysis,
  STANDARD_GRAVITY,
  type VariantInputs,
  type WebData,
} from 'wick-core';
import { createWeb, pv, transition, uniqueName } from '../../test/library';
import { startTestMailbox, type TestMailbox } from '../../test/mail';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';

/** Rows a refused upload must leave unchanged. */
async function stored(): Promise<{ runs: number; sets: number; files: number }> {
  const [row] = await testSequelize().query<{ runs: number; sets: number; files: number }>(
    `SELECT (SELECT count(*) FROM lab_runs)::int AS runs, (SELECT count(*) FROM lab_sets)::int AS sets,
            (SELECT count(*) FROM library_files)::int AS files`,
    { type: QueryTypes.SELECT },
  );
  return row;
}

const T23 = 296.15;
const deg = (d: number) => (d * Math.PI) / 180;

/** "time (s),height (mm)" rows of heights in m. */
function heightCsv(times: readonly number[], heights: readonly number[]): string {
  return ['time (s),height (mm)', ...times.map((t, i) => `${t},${(heights[i] * 1000).toFixed(4)}`), ''].join('\n');
}

/** Heights of dh/dt = a/h − b (Washburn 1921, explicit form of Fries & Dreyer 2008) with seeded Gaussian noise, m. */
function noisyRise(a: number, b: number, times: readonly number[], seed: number, sd: number): number[] {
  const rng = createRng(seed);
  return times.map((t) => Math.max(0, gravityHeight(a, b, t) + sd * rng.nextNormal()));
}

describe('lab data: runs, fits, replicate sets, contact angle, predictions and proposals', () => {
  let app: Express;
  let tomas: Agent, grace: Agent, priya: Agent;
  let mail: TestMailbox;
  let web: EntryDetail<WebData>;
  afterAll(async () => mail.stop());

  const times = Array.from({ length: 40 }, (_, i) => (i + 1) * 15);
  // A strip with a = 3e-5 m²/s and b = 5e-4 m/s: h_eq = a/b = 60 mm, t* = a/b² = 120 s; the record reaches 5 t*.
  const A = 3e-5;
  const B = 5e-4;

  function upload(agent: Agent, meta: Partial<LabRunCreate>, csv: string | Buffer, fileName = 'run.csv') {
    return agent
      .post('/api/lab-data/runs')
      .field('meta', JSON.stringify(meta))
      .attach('file', Buffer.isBuffer(csv) ? csv : Buffer.from(csv, 'utf8'), { filename: fileName, contentType: 'text/csv' });
  }

  const salineRun = (name: string, extra: Partial<LabRunCreate> = {}): Partial<LabRunCreate> => ({
    name,
    webId: web.id,
    liquid: { builtInId: 'saline-0.9' },
    temperature: T23,
    orientation: 'vertical',
    width: 0.025,
    ...extra,
  });

  beforeAll(async () => {
    mail = await startTestMailbox();
    app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
    [tomas, grace, priya] = await Promise.all(['materials-scientist', 'reviewer', 'engineer'].map(async (w) => (await signInAs(app, w)).agent));
    // An approved web with a measured porosity (needed for the permeability).
    const draft = await createWeb(tomas, uniqueName('Lab web'), { porosity: pv(0.9, '%') });
    await transition(tomas, draft.id, 'submit', draft.version).expect(200);
    web = (await transition(grace, draft.id, 'approve', draft.version + 1).expect(200)).body as EntryDetail<WebData>;
  });

  describe('uploading a run', () => {
    it('when an engineer uploads a vertical run, then it is stored with its file and both fits recover the generating h_eq', async () => {
      const h = noisyRise(A, B, times, 1, 3e-4);
      const csv = heightCsv(times, h);
      const res = await upload(priya, salineRun('Rep 1', { newSetName: uniqueName('Saline set') }), csv, 'rep-1.csv').expect(201);
      const run = res.body as LabRunDetail;
      expect(run.points).toBe(40);
      expect(run.measurement).toBe('height');
      expect(run.valueUnit).toBe('mm');
      // 1 mm = 1e-3 m (SI definition).
      expect(run.values[0]).toBeCloseTo(Number((h[0] * 1000).toFixed(4)) * 1e-3, 12);
      expect(run.web).toEqual(jasmine.objectContaining({ entryId: web.id, revision: 1, state: 'approved' }));
      expect(run.web.porosity).toBeCloseTo(0.9, 12);
      expect(run.liquid.source).toBe('built-in');
      expect(run.tilt).toBeCloseTo(Math.PI / 2, 15);
      expect(run.file.fileName).toBe('rep-1.csv');
      const file = await priya.get(`/api/lab-data/runs/${run.id}/file`).expect(200);
      expect(file.text).toBe(csv);
      expect(file.headers['x-content-sha256']).toBe(run.file.sha256);

      const g = run.analysis.gravity!;
      expect(run.analysis.gravityError).toBeNull();
      // The 95 % interval of h_eq holds the 60 mm that generated the curve (0.3 mm noise, 40 points).
      expect(g.equilibrium!.ci95[0]).toBeLessThan(A / B);
      expect(g.equilibrium!.ci95[1]).toBeGreaterThan(A / B);
      // Porous layer: k = ε η b/(ρ g) with the liquid the server used (Darcy, saturated behind the front).
      const k = (0.9 * run.liquid.viscosity * g.b.value) / (run.liquid.density * STANDARD_GRAVITY);
      expect(g.porousLayer!.permeability.value / k).toBeCloseTo(1, 10);
      // The Washburn window stops at 20 % of the estimated equilibrium (documented rule), so the slope is ≤ 2a.
      const w = run.analysis.washburn!;
      expect(w.window.count).toBeGreaterThanOrEqual(5);
      expect(w.slope).toBeLessThan(2 * A * 1.05);
      expect(run.figures.equilibrium).toBeCloseTo(g.equilibrium!.value, 15);

      const [auditRow] = await testSequelize().query<{ n: number }>(
        `SELECT count(*)::int AS n FROM audit_log WHERE entity_type = 'lab-run' AND entity_id = :id AND action = 'create'`,
        { replacements: { id: String(run.id) }, type: QueryTypes.SELECT },
      );
      expect(auditRow.n).toBe(1);
    });

    const bad: readonly [string, string, RegExp][] = [
      ['too few points', 'time (s),height (mm)\n10,5\n20,7\n30,8\n', /at least 5 readings.*has 3/],
      ['non-monotonic time', 'time (s),height (mm)\n10,5\n20,7\n15,8\n40,10\n50,11\n60,12\n', /Times must increase/],
      ['negative heights', 'time (s),height (mm)\n10,5\n20,7\n30,-8\n40,10\n50,11\n60,12\n', /must not be negative/],
      ['a flat curve', 'time (s),height (mm)\n10,5\n20,5\n30,5\n40,5\n50,5\n60,5\n', /flat curve/],
      ['a shrinking curve', 'time (s),height (mm)\n10,12\n20,11\n30,9\n40,8\n50,7\n60,5\n', /falls from the first to the last/],
      ['a column without unit', 'time (s),height\n10,5\n20,7\n30,8\n40,10\n50,11\n', /unit/],
    ];
    for (const [what, csv, message] of bad) {
      it(`when the file has ${what}, then 422 with a clear message and nothing is stored`, async () => {
        const before = await stored();
        const res = await upload(priya, salineRun(`Bad: ${what}`, { newSetName: uniqueName('Bad set') }), csv).expect(422);
        expect(res.body.error.code).toBe('upload-invalid');
        expect(JSON.stringify(res.body.error.details.issues)).toMatch(message);
        expect(res.body.error.message).toMatch(/Nothing was changed/);
        expect(await stored()).toEqual(before);
      });
    }

    it('when a height is negative, then the issue names its line in the file', async () => {
      const res = await upload(priya, salineRun('Bad line', { newSetName: uniqueName('Bad set') }), '# rig 2\ntime (s),height (mm)\n10,5\n20,7\n30,-8\n40,10\n50,11\n').expect(422);
      // Line 5: comment, header, then the third data row.
      expect(res.body.error.details.issues[0].line).toBe(5);
    });

    it('when a binary file is sent, then 415 and nothing is stored', async () => {
      const before = await stored();
      await upload(priya, salineRun('Workbook', { newSetName: uniqueName('Bad set') }), Buffer.from([0x50, 0x4b, 0x03, 0x04, 0, 0, 1, 2]), 'run.xlsx').expect(415);
      expect(await stored()).toEqual(before);
    });

    it('when the details are incomplete, then 422 names the fields and nothing is stored', async () => {
      const before = await stored();
      const csv = heightCsv(times, noisyRise(A, B, times, 2, 3e-4));
      const both = await upload(priya, { ...salineRun('No set'), orientation: 'inclined' }, csv).expect(422);
      expect(both.body.error.details.issues.map((i: { field: string }) => i.field)).toEqual(jasmine.arrayContaining(['setId', 'tilt']));
      const liquid = await upload(priya, salineRun('Unknown liquid', { liquid: { builtInId: 'mercury' }, newSetName: uniqueName('x') }), csv).expect(422);
      expect(liquid.body.error.code).toBe('unknown-liquid');
      const noWeb = await upload(priya, salineRun('No web', { webId: 999999, newSetName: uniqueName('x') }), csv).expect(422);
      expect(noWeb.body.error.details.issues[0].field).toBe('webId');
      expect(await stored()).toEqual(before);
    });

    it('when a run does not match its set, then 422 set-mismatch and nothing is stored', async () => {
      const csv = heightCsv(times, noisyRise(A, B, times, 3, 3e-4));
      const first = (await upload(priya, salineRun('Set anchor', { newSetName: uniqueName('Mismatch set') }), csv).expect(201)).body as LabRunDetail;
      const before = await stored();
      const res = await upload(priya, salineRun('Water run', { liquid: { builtInId: 'water' }, orientation: 'horizontal', setId: first.set.id }), csv).expect(422);
      expect(res.body.error.code).toBe('set-mismatch');
      expect(res.body.error.message).toMatch(/liquid.*orientation/);
      expect(await stored()).toEqual(before);
    });

    it('when a mass curve is uploaded, then the Washburn slope is in kg²/s and no radii are derived', async () => {
      // m = ρ ε A h for a strip 25 mm × 1.5 mm (mass uptake of a saturated strip).
      const h = noisyRise(A, B, times, 4, 2e-4);
      const m = h.map((x) => 1004.6 * 0.9 * 0.025 * 0.0015 * x);
      const csv = ['time (s),mass (g)', ...times.map((t, i) => `${t},${(m[i] * 1000).toFixed(5)}`), ''].join('\n');
      const run = (await upload(priya, salineRun('Mass run', { newSetName: uniqueName('Mass set') }), csv).expect(201)).body as LabRunDetail;
      expect(run.measurement).toBe('mass');
      expect(run.analysis.washburn!.unit).toBe('kg^2/s');
      expect(run.analysis.gravity!.capillary).toBeNull();
      expect(run.analysis.gravity!.porousLayer).toBeNull();
    });
  });

  describe('fit settings', () => {
    let run: LabRunDetail;
    beforeAll(async () => {
      run = (await upload(priya, salineRun('Window run', { newSetName: uniqueName('Window set') }), heightCsv(times, noisyRise(A, B, times, 5, 3e-4))).expect(201)).body;
    });

    it('when an explicit window and a contact angle are saved, then the run is refitted with them', async () => {
      const res = await priya
        .put(`/api/lab-data/runs/${run.id}`)
        .send({ version: run.version, name: 'Window run', conditions: '23 °C, 50 % RH', notes: '', fit: { window: { start: 30, end: 120 }, intercept: true, contactAngle: deg(40) } })
        .expect(200);
      const next = res.body as LabRunDetail;
      expect(next.version).toBe(run.version + 1);
      expect(next.analysis.washburn!.window).toEqual(jasmine.objectContaining({ start: 30, end: 120, count: 7 }));
      // r_d = 4ηa/(γ cosθ) with the saved θ = 40° (fitting/gravity-fit.ts, from a = γ r cosθ/(4η)).
      const g = next.analysis.gravity!;
      const rd = (4 * next.liquid.viscosity * g.a.value) / (next.liquid.surfaceTension * Math.cos(deg(40)));
      expect(g.capillary!.dynamicRadius.value / rd).toBeCloseTo(1, 10);
      run = next;
    });

    it('when the version is stale, then 409 with the current run; when the window holds too few points, then 422 and nothing changes', async () => {
      const stale = await priya.put(`/api/lab-data/runs/${run.id}`).send({ version: run.version - 1, name: 'x', conditions: '', notes: '', fit: { window: 'auto', intercept: false, contactAngle: null } }).expect(409);
      expect(stale.body.error.details.current.version).toBe(run.version);
      const narrow = await priya.put(`/api/lab-data/runs/${run.id}`).send({ version: run.version, name: 'x', conditions: '', notes: '', fit: { window: { start: 30, end: 40 }, intercept: false, contactAngle: null } }).expect(422);
      expect(narrow.body.error.message).toMatch(/at least 3/);
      const now = (await priya.get(`/api/lab-data/runs/${run.id}`).expect(200)).body as LabRunDetail;
      expect(now.version).toBe(run.version);
      expect(now.name).toBe('Window run');
    });

    it('when a materials scientist reads, then allowed; changing needs the engineer role', async () => {
      const read = (await tomas.get(`/api/lab-data/runs/${run.id}`).expect(200)).body as LabRunDetail;
      expect(read.actions).toEqual({ edit: false, delete: false });
      await tomas.put(`/api/lab-data/runs/${run.id}`).send({ version: run.version, name: 'x', conditions: '', notes: '', fit: { window: 'auto', intercept: false, contactAngle: null } }).expect(403);
    });
  });

  describe('replicate sets', () => {
    it('when four runs are alike and one wicked at half the rate, then mean and spread are given and that run is flagged', async () => {
      const setName = uniqueName('Replicates');
      const ids: number[] = [];
      let setId = 0;
      for (let i = 0; i < 5; i++) {
        const a = i === 4 ? A / 2 : A;
        const meta = salineRun(`Replicate ${i + 1}`, i === 0 ? { newSetName: setName } : { setId });
        const run = (await upload(priya, meta, heightCsv(times, noisyRise(a, B, times, 10 + i, 3e-4))).expect(201)).body as LabRunDetail;
        setId = run.set.id;
        ids.push(run.id);
      }
      const set = (await priya.get(`/api/lab-data/sets/${setId}`).expect(200)).body as LabSetDetail;
      expect(set.runCount).toBe(5);
      const a = set.figures.find((f) => f.key === 'a')!;
      // Modified z-score > 3.5 (Iglewicz & Hoaglin 1993) for the half-rate run only.
      expect(a.outlierRunIds).toEqual([ids[4]]);
      expect(a.statistics.withoutOutliers.n).toBe(4);
      expect(a.statistics.withoutOutliers.mean / A).toBeCloseTo(1, 1);
      expect(set.warnings.map((w) => w.code)).toContain('outlier-run');
      const listed = (await priya.get('/api/lab-data/runs').query({ setId }).expect(200)).body as { id: number; points: number }[];
      expect(listed.map((r) => r.id).sort()).toEqual([...ids].sort());
      expect(listed.every((r) => r.points === 40)).toBeTrue();
    });
  });

  describe('contact angle by the reference-liquid method', () => {
    it('when n-hexane and saline sets of the same web are given, then θ used to make the saline curves comes back, with the caution', async () => {
      // Horizontal strips (no gravity): h² = γ r cosθ t/(2η) (Washburn 1921), r = 40 µm, θ(saline) = 55°, 1 % noise.
      const r = 40e-6;
      const hexane = liquidAt('n-hexane', T23);
      const saline = liquidAt('saline-0.9', T23);
      const rise = (l: typeof hexane, cos: number, seed: number) => {
        const K = (l.surfaceTension * r * cos) / (2 * l.viscosity);
        const rng = createRng(seed);
        return times.map((t) => Math.sqrt(K * t) * (1 + 0.01 * rng.nextNormal()));
      };
      const refName = uniqueName('Hexane set');
      const testName = uniqueName('Saline horizontal');
      let refId = 0;
      let testId = 0;
      for (let i = 0; i < 3; i++) {
        const ref = (await upload(priya, { ...salineRun(`Hexane ${i + 1}`), liquid: { builtInId: 'n-hexane' }, orientation: 'horizontal', ...(i ? { setId: refId } : { newSetName: refName }) }, heightCsv(times, rise(hexane, 1, 20 + i))).expect(201)).body as LabRunDetail;
        refId = ref.set.id;
        const test = (await upload(priya, { ...salineRun(`Saline ${i + 1}`), orientation: 'horizontal', ...(i ? { setId: testId } : { newSetName: testName }) }, heightCsv(times, rise(saline, Math.cos(deg(55)), 30 + i))).expect(201)).body as LabRunDetail;
        testId = test.set.id;
        expect(test.analysis.gravity).toBeNull();
        expect(test.analysis.gravityError!.code).toBe('no-gravity-term');
      }
      const res = (await tomas.get('/api/lab-data/contact-angle').query({ reference: refId, test: testId }).expect(200)).body as ContactAngleAnalysis;
      expect(res.quantity).toBe('height');
      expect(res.reference.slopes.length).toBe(3);
      // θ within 1.5° of the 55° that generated the data (1 % noise per reading).
      expect(Math.abs((res.result.contactAngle * 180) / Math.PI - 55)).toBeLessThan(1.5);
      // C_h = r_eff/2 for a capillary bundle (REFERENCES.md, "Washburn contact-angle method").
      expect(res.result.materialConstant.mean / (r / 2)).toBeCloseTo(1, 1);
      expect(res.caution).toMatch(/flammable/);
      expect(res.caution).toMatch(/fume hood/);
      expect(res.warnings.map((w) => w.code)).not.toContain('reference-not-wetting');

      const swapped = (await tomas.get('/api/lab-data/contact-angle').query({ reference: testId, test: refId }).expect(200)).body as ContactAngleAnalysis;
      expect(swapped.warnings.map((w) => w.code)).toContain('reference-not-wetting');
      await tomas.get('/api/lab-data/contact-angle').query({ reference: refId, test: refId }).expect(422);
    });
  });

  describe('prediction versus measurement', () => {
    it('when the measurement is a variant’s own curve plus 0.5 mm noise, then RMSE ≈ 0.5 mm and the time-to-height errors are small', async () => {
      const inputs: VariantInputs = {
        configuration: 'vertical-strip',
        structure: {
          web: { kind: 'web', id: web.id, revision: web.head.number, name: web.head.name, state: 'approved' },
          fibreDiameter: 20e-6,
          fibreDensity: 1380,
          basisWeight: 0.12,
          thickness: 0.0015,
          porosity: 0.9,
          contactAngle: deg(40),
          permeability: { mode: 'measured', value: 3e-10 },
        },
        liquid: { ref: 'saline-0.9', temperature: T23 },
        dimensions: { width: 0.025, length: 0.3, duration: 600 },
        checkpoints: { heights: [0.01, 0.02], times: [10, 60] },
      };
      const project = (await priya.post('/api/projects').send({ name: uniqueName('Lab project') }).expect(201)).body as { id: number };
      const design = (await priya.post(`/api/projects/${project.id}/designs`).send({ name: 'Strip check' }).expect(201)).body as { id: number };
      const variant = (await priya.post(`/api/designs/${design.id}/variants`).send({ name: 'Variant for lab', inputs }).expect(201)).body as { id: number };

      const predicted = evaluateVariant(inputs, DEFAULT_VARIANT_OPTIONS);
      if (predicted.status !== 'ok') throw new Error('variant gives no uptake');
      const t = Array.from({ length: 30 }, (_, i) => (i + 1) * 20);
      const rng = createRng(42);
      const interp = (x: number) => {
        const ts = predicted.curves.time;
        const k = ts.findIndex((v) => v >= x);
        const f = (x - ts[k - 1]) / (ts[k] - ts[k - 1]);
        return predicted.curves.height[k - 1] + f * (predicted.curves.height[k] - predicted.curves.height[k - 1]);
      };
      const h = t.map((x) => interp(x) + 5e-4 * rng.nextNormal());
      const run = (await upload(priya, salineRun('Prediction run', { newSetName: uniqueName('Prediction set') }), heightCsv(t, h)).expect(201)).body as LabRunDetail;

      const candidates = (await priya.get(`/api/lab-data/runs/${run.id}/predictions`).expect(200)).body as PredictionCandidate[];
      expect(candidates.map((c) => c.variantId)).toContain(variant.id);
      expect(candidates.find((c) => c.variantId === variant.id)!.matches).toEqual({ configuration: true, webRevision: true });

      const cmp = (await priya.get(`/api/lab-data/runs/${run.id}/predictions/${variant.id}`).expect(200)).body as PredictionComparison;
      expect(cmp.metrics.n).toBe(30);
      // RMSE of pure N(0, 0.5 mm) noise over 30 points: within ±35 % of 0.5 mm (χ² with 30 dof, 99.9 %).
      expect(cmp.metrics.rmse).toBeGreaterThan(0.65 * 5e-4);
      expect(cmp.metrics.rmse).toBeLessThan(1.35 * 5e-4);
      expect(Math.abs(cmp.metrics.maxDeviation.value)).toBeLessThan(5 * 5e-4);
      expect(cmp.metrics.timeToHeight.length).toBe(3);
      for (const th of cmp.metrics.timeToHeight) expect(Math.abs(th.relativeError!)).toBeLessThan(0.15);

      // A materials scientist reads lab data but not designs.
      await tomas.get(`/api/lab-data/runs/${run.id}/predictions`).expect(403);
      await priya.get(`/api/lab-data/runs/${run.id}/predictions/999999`).expect(404);
    });
  });

  describe('proposing to the library', () => {
    it('when an engineer proposes a set, then a new web revision is in review with permeability, curves and a link; a reviewer approves it', async () => {
      const setName = uniqueName('Proposal set');
      let setId = 0;
      const runIds: number[] = [];
      for (let i = 0; i < 3; i++) {
        const run = (await upload(priya, salineRun(`P${i + 1}`, i ? { setId } : { newSetName: setName }), heightCsv(times, noisyRise(A, B, times, 50 + i, 3e-4))).expect(201)).body as LabRunDetail;
        setId = run.set.id;
        runIds.push(run.id);
      }
      const current = (await priya.get(`/api/library/webs/${web.id}`).expect(200)).body as EntryDetail<WebData>;
      const set = (await priya.post(`/api/lab-data/sets/${setId}/propose`).send({ webVersion: current.version }).expect(200)).body as LabSetDetail;
      expect(set.proposals.length).toBe(1);
      const p = set.proposals[0];
      expect(p).toEqual(jasmine.objectContaining({ entryId: web.id, revision: current.head.number + 1, submitted: true, runIds }));

      const entry = (await grace.get(`/api/library/webs/${web.id}`).expect(200)).body as EntryDetail<WebData>;
      expect(entry.head.state).toBe('in-review');
      expect(entry.head.number).toBe(p.revision);
      const k = set.figures.find((f) => f.key === 'permeability')!.statistics.withoutOutliers;
      const written = entry.head.data.permeabilityInPlane;
      if (written?.mode !== 'measured') throw new Error('no measured permeability written');
      expect(written.value.si / k.mean).toBeCloseTo(1, 12);
      expect(written.value.uncertainty! / (k.sd / Math.sqrt(k.n))).toBeCloseTo(1, 12);
      expect(entry.head.data.curves.map((c) => c.key)).toEqual(jasmine.arrayContaining(runIds.map((id) => `lab-run-${id}`)));
      expect(entry.head.notes).toContain(`/lab-data/sets/${setId}`);
      expect(entry.head.notes).toMatch(/confirm with the standard test methods/);
      await mail.waitFor((m) => m.subject.includes('Review requested') && m.subject.includes(entry.head.name));

      // Nothing more can be proposed while that revision is open.
      const open = await priya.post(`/api/lab-data/sets/${setId}/propose`).send({ webVersion: entry.version }).expect(409);
      expect(open.body.error.code).toBe('open-revision');

      const approved = (await transition(grace, web.id, 'approve', entry.version).expect(200)).body as EntryDetail<WebData>;
      expect(approved.head.state).toBe('approved');

      // The runs behind it are evidence now; a stale web version is refused.
      const run = (await priya.get(`/api/lab-data/runs/${runIds[0]}`).expect(200)).body as LabRunDetail;
      expect(run.actions.delete).toBeFalse();
      expect((await priya.delete(`/api/lab-data/runs/${runIds[0]}`).query({ version: run.version }).expect(409)).body.error.code).toBe('run-proposed');
      expect((await priya.post(`/api/lab-data/sets/${setId}/propose`).send({ webVersion: entry.version }).expect(409)).body.error.code).toBe('version-conflict');
      web = approved;
    });

    it('when a run that backs no proposal is deleted, then its set, when emptied, goes too', async () => {
      const run = (await upload(priya, salineRun('Lonely', { newSetName: uniqueName('Lonely set') }), heightCsv(times, noisyRise(A, B, times, 60, 3e-4))).expect(201)).body as LabRunDetail;
      const before = await stored();
      await priya.delete(`/api/lab-data/runs/${run.id}`).query({ version: run.version }).expect(204);
      expect(await stored()).toEqual({ runs: before.runs - 1, sets: before.sets - 1, files: before.files - 1 });
      await priya.get(`/api/lab-data/sets/${run.set.id}`).expect(404);
    });
  });
});
