import { QueryTypes } from 'sequelize';
import type { LibraryKind } from 'wick-core';
import { DEMO_LIBRARY_NAMES, down, up } from '../../../migrations/seeders/03-library';
import { testSequelize } from '../../test/test-app';
import { DATA_SCHEMAS } from './library';

describe('demo library seeder', () => {
  it('when it runs, then every seeded revision passes the API schema and the mix of states the demo needs is there; down removes it', async () => {
    const sequelize = testSequelize();
    const context = { queryInterface: sequelize.getQueryInterface(), sequelize };
    await up({ context });
    try {
      const rows = await sequelize.query<{ kind: LibraryKind; name: string; state: string; data: unknown; head: boolean; approved: boolean }>(
        `SELECT e.kind, r.name, r.state, r.data, e.head_revision_id = r.id AS head, e.approved_revision_id = r.id AS approved
           FROM library_entries e JOIN library_revisions r ON r.entry_id = e.id
          WHERE r.name IN (:names)`,
        { replacements: { names: DEMO_LIBRARY_NAMES }, type: QueryTypes.SELECT },
      );
      for (const r of rows) {
        const parsed = DATA_SCHEMAS[r.kind].safeParse(r.data);
        expect(parsed.success).withContext(`${r.name}: ${parsed.success ? '' : JSON.stringify(parsed.error.issues)}`).toBeTrue();
      }
      const heads = rows.filter((r) => r.head);
      const count = (kind: LibraryKind) => heads.filter((r) => r.kind === kind).length;
      expect(count('fibre')).toBeGreaterThanOrEqual(8);
      expect(count('web')).toBeGreaterThanOrEqual(10);
      expect(count('liquid')).toBeGreaterThanOrEqual(6);
      const states = new Set(heads.map((r) => r.state));
      for (const s of ['approved', 'in-review', 'returned', 'draft']) expect(states).toContain(s);
      expect(heads.filter((r) => r.state === 'returned').length).toBe(1);
      // One approved web with a newer revision in review: the approved one stays in force.
      expect(rows.some((r) => r.kind === 'web' && r.approved && !r.head)).toBeTrue();
    } finally {
      await down({ context });
    }
    const [left] = await sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM library_revisions WHERE name = 'Calloway TAB-40 acquisition layer'`, {
      type: QueryTypes.SELECT,
    });
    expect(left.n).toBe(0);
  });
});
