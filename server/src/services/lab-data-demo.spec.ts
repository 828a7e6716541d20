import { QueryTypes } from 'sequelize';
import { type ContactAngleAnalysis, type LabRunDetail, type LabSetDetail, type LabSetSummary, type PredictionCandidate, type PredictionComparison, STANDARD_GRAVITY } from 'wick-core';
import * as library from '../../../migrations/seeders/03-library';
import * as designs from '../../../migrations/seeders/04-designs';
import { DEMO_SET_NAMES, down, K_PERM, PC_SALINE, THETA_SALINE, up } from '../../../migrations/seeders/05-lab-data';
import { signInAs } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';

describe('demo lab data seeder', () => {
  it('when it runs after the demo library and designs, then its fits recover the values that generated the curves; down removes it', async () => {
    const sequelize = testSequelize();
    const context = { queryInterface: sequelize.getQueryInterface(), sequelize };
    await library.up({ context });
    await designs.up({ context });
    await up({ context });
    try {
      const app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
      const { agent } = await signInAs(app, 'engineer');
      const sets = ((await agent.get('/api/lab-data/sets').expect(200)).body as LabSetSummary[]).filter((s) => (DEMO_SET_NAMES as readonly string[]).includes(s.name));
      const saline = sets.find((s) => s.name === DEMO_SET_NAMES[0])!;
      const hexane = sets.find((s) => s.name === DEMO_SET_NAMES[1])!;
      expect([saline.runCount, hexane.runCount]).toEqual([3, 1]);

      const detail = (await agent.get(`/api/lab-data/sets/${saline.id}`).expect(200)).body as LabSetDetail;
      for (const summary of detail.runs) {
        const run = (await agent.get(`/api/lab-data/runs/${summary.id}`).expect(200)).body as LabRunDetail;
        const eq = run.analysis.gravity!.equilibrium!;
        // h_eq = Pc/(ρ g) (Darcy behind the front, the seeder's invented Pc), within 3 standard errors.
        expect(Math.abs(eq.value - PC_SALINE / (run.liquid.density * STANDARD_GRAVITY))).toBeLessThan(3 * eq.stdError);
      }
      // Specimens at k·(1.04, 0.97, 1.01): the mean permeability lies within 5 % of k.
      const k = detail.figures.find((f) => f.key === 'permeability')!.statistics.mean;
      expect(Math.abs(k / K_PERM - 1)).toBeLessThan(0.05);

      // Reference-liquid method on the demo: θ near the 50° of the saline curves. The Washburn windows end at
      // 20 % of each equilibrium, where gravity lowers both slopes by similar shares (documented bias).
      const ca = (await agent.get('/api/lab-data/contact-angle').query({ reference: hexane.id, test: saline.id }).expect(200)).body as ContactAngleAnalysis;
      expect(Math.abs(ca.result.contactAngle - THETA_SALINE)).toBeLessThan((5 * Math.PI) / 180);

      // The saline runs meet the seeded acquisition-layer variant that uses the same web and library saline.
      const candidates = (await agent.get(`/api/lab-data/runs/${detail.runs[0].id}/predictions`).expect(200)).body as PredictionCandidate[];
      const adl = candidates.find((c) => c.variantName.startsWith('ADL A'));
      expect(adl?.matches.configuration).toBeTrue();
      const cmp = (await agent.get(`/api/lab-data/runs/${detail.runs[0].id}/predictions/${adl!.variantId}`).expect(200)).body as PredictionComparison;
      expect(cmp.metrics.n).toBe(detail.runs[0].points);
    } finally {
      await down({ context });
      await designs.down({ context });
      await library.down({ context });
    }
    const [left] = await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM lab_sets WHERE name IN (:names)', {
      replacements: { names: [...DEMO_SET_NAMES] },
      type: QueryTypes.SELECT,
    });
    expect(left.n).toBe(0);
  });
});
