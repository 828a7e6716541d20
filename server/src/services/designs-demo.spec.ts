import { QueryTypes } from 'sequelize';
import { evaluateAnyVariant, type AnyVariantInputs, type ProjectDetail, type ProjectSummary, type StackVariantResults, type VariantDetail } from 'wick-core';
import * as library from '../../../migrations/seeders/03-library';
import { DEMO_PROJECT, down, up } from '../../../migrations/seeders/04-designs';
import { signInAs } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';

describe('demo design seeder', () => {
  it('when it runs after the demo library, then every variant reads back with the results the server computes from its inputs, stack variants included; down removes it', async () => {
    const sequelize = testSequelize();
    const context = { queryInterface: sequelize.getQueryInterface(), sequelize };
    await library.up({ context });
    await up({ context });
    try {
      const app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
      const { agent } = await signInAs(app, 'engineer');
      const projects = (await agent.get('/api/projects').expect(200)).body as ProjectSummary[];
      const project = projects.find((p) => p.name === DEMO_PROJECT)!;
      const detail = (await agent.get(`/api/projects/${project.id}`).expect(200)).body as ProjectDetail;
      expect(detail.designs.length).toBe(3);
      expect(detail.decisions.length).toBe(1);
      const summaries = detail.designs.flatMap((d) => d.variants);
      expect(summaries.length).toBe(9);
      expect(summaries.filter((v) => (v.configuration as string) === 'stack').length).toBe(2);

      for (const s of summaries) {
        const v = (await agent.get(`/api/variants/${s.id}`).expect(200)).body as VariantDetail;
        // The seeded snapshot is what the server's evaluator gives for the stored inputs (the server is the record).
        const again = evaluateAnyVariant(v.inputs as AnyVariantInputs).results;
        expect(v.results).withContext(s.name).toEqual(JSON.parse(JSON.stringify(again)));
        expect(v.results.status).withContext(s.name).toBe('ok');
        // Every pinned revision, the liquid's included, is listed with its library state.
        expect(v.materials.length).withContext(s.name).toBeGreaterThan(0);
      }

      // The demo's story: 45 mL into 200 cm². With the acquisition layer the stack has the pore volume for all three
      // gushes; without it the third finds the stack full and stands on the surface (capacity = ε·thickness·area).
      const stacks = await Promise.all(
        summaries
          .filter((v) => (v.configuration as string) === 'stack')
          .map(async (s) => ((await agent.get(`/api/variants/${s.id}`).expect(200)).body as { name: string; results: StackVariantResults })),
      );
      const withAdl = stacks.find((v) => v.name.includes('with '))!.results;
      const without = stacks.find((v) => v.name.includes('without'))!.results;
      for (const r of [withAdl, without]) expect(r.massBalance.relativeError).toBeLessThan(1e-6);
      expect(withAdl.insults.map((g) => g.acquisitionTime !== null)).toEqual([true, true, true]);
      expect(without.insults[2].acquisitionTime).toBeNull();
    } finally {
      await down({ context });
      await library.down({ context });
    }
    const [left] = await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM projects WHERE name = :name', {
      replacements: { name: DEMO_PROJECT },
      type: QueryTypes.SELECT,
    });
    expect(left.n).toBe(0);
  });
});
