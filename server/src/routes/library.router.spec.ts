import type { Express } from 'express';
import request from 'supertest';
import type { EntryDetail, EntrySummary, Page, RevisionDiff, RevisionSummary, WebData } from 'wick-core';
import { createWeb, fibreInput, liquidInput, pv, transition, uniqueName, webInput } from '../../test/library';
import { startTestMailbox, type TestMailbox } from '../../test/mail';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';

describe('library entries: revisions, review and locking', () => {
  let mail: TestMailbox;
  let app: Express;
  /** tomas: materials scientist · grace: reviewer · lena: both · priya: engineer · ada: admin. */
  let tomas: Agent, grace: Agent, lena: Agent, priya: Agent, ada: Agent;

  beforeAll(async () => {
    mail = await startTestMailbox();
    app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
    [tomas, grace, lena, priya, ada] = await Promise.all(
      ['materials-scientist', 'reviewer', 'lena', 'engineer', 'admin'].map(async (who) => (await signInAs(app, who)).agent),
    );
  });
  afterAll(async () => mail.stop());

  describe('create and read', () => {
    it('when a materials scientist creates a web, then 201 with revision 1 as a draft, version 1 and edit actions', async () => {
      const name = uniqueName('Airlaid core');
      const res = await tomas.post('/api/library/webs').send(webInput(name)).expect(201);
      const e = res.body as EntryDetail<WebData>;
      expect(e.kind).toBe('web');
      expect(e.version).toBe(1);
      expect(e.head.number).toBe(1);
      expect(e.head.state).toBe('draft');
      expect(e.head.name).toBe(name);
      expect(e.head.createdBy.name).toBe('Tomás Lindqvist');
      expect(e.head.data.basisWeight).toEqual(pv(0.12, 'g/m^2'));
      expect(e.approved).toBeNull();
      expect(e.actions).toEqual(jasmine.objectContaining({ edit: true, submit: true, approve: false, deleteDraft: true }));
      const read = await priya.get(`/api/library/webs/${e.id}`).expect(200);
      expect(read.body.head.name).toBe(name);
      expect(read.body.actions).toEqual(jasmine.objectContaining({ edit: false, submit: false, approve: false }));
    });

    it('when an engineer, a reviewer or an administrator tries to create, then 403 and nothing is stored', async () => {
      const name = uniqueName('Forbidden web');
      for (const agent of [priya, grace, ada]) {
        const res = await agent.post('/api/library/webs').send(webInput(name)).expect(403);
        expect(res.body.error.code).toBe('forbidden');
      }
      const list = await priya.get('/api/library/webs').query({ q: name }).expect(200);
      expect(list.body.total).toBe(0);
    });

    it('when nobody is signed in, then reading the library answers 401', async () => {
      const res = await request(app).get('/api/library/webs').expect(401);
      expect(res.body.error.code).toBe('unauthenticated');
    });

    it('when the body breaks rules, then 422 naming each field and the rule it broke', async () => {
      const bad = webInput('', {
        basisWeight: pv(0.12, 'mm'),
        blend: [
          { fibreName: 'PP', massFraction: 0.5 },
          { fibreName: 'PET', massFraction: 0.3 },
        ],
        thicknessPressure: undefined,
      });
      const res = await tomas.post('/api/library/webs').send(bad).expect(422);
      expect(res.body.error.code).toBe('validation-failed');
      const issues = res.body.error.details.issues as { field: string; rule: string; message: string }[];
      const rules = Object.fromEntries(issues.map((i) => [i.field, i.rule]));
      expect(rules['name']).toBe('too_small:string');
      expect(rules['data.basisWeight.unit']).toBe('unit-dimension');
      expect(rules['data.blend']).toBe('fractions-sum');
      expect(rules['data.thicknessPressure']).toBe('thickness-needs-pressure');
      for (const i of issues) expect(i.message.length).toBeGreaterThan(5);
    });

    it('when a value is far outside the plausible range (g/m² typed as kg/m²), then 422 with rule "range"', async () => {
      const res = await tomas.post('/api/library/webs').send(webInput(uniqueName('Heavy'), { basisWeight: pv(120, 'kg/m^2') })).expect(422);
      expect(res.body.error.details.issues).toContain(jasmine.objectContaining({ field: 'data.basisWeight.si', rule: 'range' }));
    });

    it('when a fibre and a liquid are created, then each kind keeps its own data and list', async () => {
      const fibreName = uniqueName('PP staple');
      const liquidName = uniqueName('Saline batch');
      const f = await tomas.post('/api/library/fibres').send(fibreInput(fibreName)).expect(201);
      const l = await tomas.post('/api/library/liquids').send(liquidInput(liquidName)).expect(201);
      expect(f.body.head.data.polymer).toBe('polypropylene');
      expect(l.body.head.data.surfaceTension.mode).toBe('constant');
      await priya.get(`/api/library/webs/${f.body.id}`).expect(404);
      const fibres = (await priya.get('/api/library/fibres').query({ q: fibreName }).expect(200)).body as Page<EntrySummary>;
      expect(fibres.items.map((i) => i.name)).toEqual([fibreName]);
      expect(fibres.items[0].figures['linearDensity']).toEqual({ si: 1.7e-7, unit: 'dtex' });
    });

    it('when a fibre has neither linear density nor diameter, then 422 with rule "size-required"', async () => {
      const res = await tomas.post('/api/library/fibres').send(fibreInput(uniqueName('No size'), { linearDensity: undefined })).expect(422);
      expect(res.body.error.details.issues).toContain(jasmine.objectContaining({ field: 'data.linearDensity', rule: 'size-required' }));
    });
  });

  describe('state transitions by role', () => {
    it('walks draft → in review → approved → new draft → in review → returned → draft → in review → approved, refusing what each state forbids', async () => {
      const name = uniqueName('Through-air ADL');
      let e = await createWeb(tomas, name);
      const id = e.id;

      // draft: nobody may approve or return it; engineers may not submit.
      expect((await transition(grace, id, 'approve', e.version).expect(409)).body.error.code).toBe('wrong-state');
      expect((await transition(grace, id, 'return', e.version, 'no').expect(409)).body.error.code).toBe('wrong-state');
      expect((await transition(priya, id, 'submit', e.version).expect(403)).body.error.code).toBe('forbidden');
      expect((await transition(grace, id, 'submit', e.version).expect(403)).body.error.code).toBe('forbidden');

      e = (await transition(tomas, id, 'submit', e.version).expect(200)).body;
      expect(e.head.state).toBe('in-review');
      expect(e.head.submittedBy?.name).toBe('Tomás Lindqvist');

      // in review: no edits, no second submit, no deletion; only reviewers decide.
      expect((await tomas.put(`/api/library/webs/${id}`).send({ ...webInput(name), version: e.version }).expect(409)).body.error.code).toBe('wrong-state');
      expect((await transition(tomas, id, 'submit', e.version).expect(409)).body.error.code).toBe('wrong-state');
      expect((await tomas.delete(`/api/library/webs/${id}/draft`).query({ version: e.version }).expect(409)).body.error.code).toBe('wrong-state');
      expect((await transition(tomas, id, 'approve', e.version).expect(403)).body.error.code).toBe('forbidden');
      expect((await transition(priya, id, 'approve', e.version).expect(403)).body.error.code).toBe('forbidden');
      expect((await transition(ada, id, 'approve', e.version).expect(403)).body.error.code).toBe('forbidden');

      e = (await transition(grace, id, 'approve', e.version, 'Datasheet checked.').expect(200)).body;
      expect(e.head.state).toBe('approved');
      expect(e.head.reviewedBy?.name).toBe('Grace Adebayo');
      expect(e.head.reviewComment).toBe('Datasheet checked.');
      expect(e.approved).toBeNull();
      expect(e.actions.deleteDraft).toBeFalse();

      // approved: never changed; an edit starts revision 2 as a draft, the approved one stays in force.
      expect((await tomas.delete(`/api/library/webs/${id}/draft`).query({ version: e.version }).expect(409)).body.error.code).toBe('wrong-state');
      const edited = webInput(name, { basisWeight: pv(0.035, 'g/m^2') });
      e = (await tomas.put(`/api/library/webs/${id}`).send({ ...edited, version: e.version }).expect(200)).body;
      expect(e.head.number).toBe(2);
      expect(e.head.state).toBe('draft');
      expect(e.approved?.number).toBe(1);
      expect((e.approved?.data as WebData).basisWeight.si).toBe(0.12);
      const rev1 = (await priya.get(`/api/library/webs/${id}/revisions/1`).expect(200)).body;
      expect(rev1.state).toBe('approved');
      expect(rev1.data.basisWeight.si).toBe(0.12);

      e = (await transition(tomas, id, 'submit', e.version).expect(200)).body;
      expect((await transition(grace, id, 'return', e.version, '').expect(422)).body.error.details.issues[0].field).toBe('comment');
      e = (await transition(grace, id, 'return', e.version, 'Thickness pressure missing from the datasheet reference.').expect(200)).body;
      expect(e.head.state).toBe('returned');
      expect(e.head.reviewComment).toContain('Thickness pressure');
      expect(e.actions).toEqual(jasmine.objectContaining({ edit: false, approve: false }));

      // returned: the author edits it (back to draft, comment kept) and submits again; lena approves.
      e = (await tomas.put(`/api/library/webs/${id}`).send({ ...edited, notes: 'Pressure 0.5 kPa per datasheet', version: e.version }).expect(200)).body;
      expect(e.head.number).toBe(2);
      expect(e.head.state).toBe('draft');
      expect(e.head.reviewComment).toContain('Thickness pressure');
      e = (await transition(tomas, id, 'submit', e.version).expect(200)).body;
      e = (await transition(lena, id, 'approve', e.version).expect(200)).body;
      expect(e.head.number).toBe(2);
      expect(e.head.state).toBe('approved');

      // The newer approval supersedes revision 1.
      const history = (await priya.get(`/api/library/webs/${id}/revisions`).expect(200)).body as RevisionSummary[];
      expect(history.map((r) => [r.number, r.state, r.superseded])).toEqual([
        [2, 'approved', false],
        [1, 'approved', true],
      ]);
    });

    it('when a draft is deleted, then only drafts go: the approved revision becomes the head again, a lone draft takes its entry along', async () => {
      let e = await createWeb(tomas, uniqueName('Deletable'));
      e = (await transition(tomas, e.id, 'submit', e.version).expect(200)).body;
      e = (await transition(grace, e.id, 'approve', e.version).expect(200)).body;
      e = (await tomas.put(`/api/library/webs/${e.id}`).send({ ...webInput(e.head.name), version: e.version }).expect(200)).body;
      expect(e.head.number).toBe(2);
      expect((await priya.delete(`/api/library/webs/${e.id}/draft`).query({ version: e.version }).expect(403)).body.error.code).toBe('forbidden');
      const after = (await tomas.delete(`/api/library/webs/${e.id}/draft`).query({ version: e.version }).expect(200)).body.entry as EntryDetail;
      expect(after.head.number).toBe(1);
      expect(after.head.state).toBe('approved');
      expect(after.revisions.length).toBe(1);

      const lone = await createWeb(tomas, uniqueName('Lone draft'));
      const gone = await tomas.delete(`/api/library/webs/${lone.id}/draft`).query({ version: lone.version }).expect(200);
      expect(gone.body.entry).toBeNull();
      await tomas.get(`/api/library/webs/${lone.id}`).expect(404);
    });
  });

  describe('four-eyes', () => {
    it('when a reviewer submitted the revision, then they cannot approve or return it, and a second reviewer can', async () => {
      let e = await createWeb(lena, uniqueName('Lena wound pad'));
      e = (await transition(lena, e.id, 'submit', e.version).expect(200)).body;
      expect(e.actions.approve).toBeFalse();
      expect(e.actions.reviewBlockedReason).toContain('second reviewer');
      const own = await transition(lena, e.id, 'approve', e.version).expect(403);
      expect(own.body.error.code).toBe('four-eyes');
      expect((await transition(lena, e.id, 'return', e.version, 'self').expect(403)).body.error.code).toBe('four-eyes');
      const state = (await lena.get(`/api/library/webs/${e.id}`).expect(200)).body as EntryDetail;
      expect(state.head.state).toBe('in-review');
      expect(state.version).toBe(e.version);
      e = (await transition(grace, e.id, 'approve', e.version).expect(200)).body;
      expect(e.head.state).toBe('approved');
    });

    it('when a reviewer only edited a draft someone else submitted, then they still may not decide on it', async () => {
      let e = await createWeb(tomas, uniqueName('Co-edited'));
      e = (await lena.put(`/api/library/webs/${e.id}`).send({ ...webInput(e.head.name, { basisWeight: pv(0.05, 'g/m^2') }), version: e.version }).expect(200)).body;
      e = (await transition(tomas, e.id, 'submit', e.version).expect(200)).body;
      expect((await transition(lena, e.id, 'approve', e.version).expect(403)).body.error.code).toBe('four-eyes');
      await transition(grace, e.id, 'approve', e.version).expect(200);
    });
  });

  describe('optimistic locking', () => {
    it('when two people save from the same version, then the second gets 409 with the current entry and nothing of theirs is stored', async () => {
      const name = uniqueName('Contested');
      const e = await createWeb(tomas, name);
      const first = await tomas.put(`/api/library/webs/${e.id}`).send({ ...webInput(name, { basisWeight: pv(0.05, 'g/m^2') }), version: e.version }).expect(200);
      const second = await lena.put(`/api/library/webs/${e.id}`).send({ ...webInput(name, { basisWeight: pv(0.07, 'g/m^2') }), version: e.version }).expect(409);
      expect(second.body.error.code).toBe('version-conflict');
      expect(second.body.error.details.current.version).toBe(first.body.version);
      expect(second.body.error.details.current.head.data.basisWeight.si).toBe(0.05);
      const now = (await priya.get(`/api/library/webs/${e.id}`).expect(200)).body as EntryDetail<WebData>;
      expect(now.head.data.basisWeight.si).toBe(0.05);
      expect(now.head.updatedBy.name).toBe('Tomás Lindqvist');
    });

    it('when a reviewer decides on a version that changed meanwhile, then 409 and the revision stays in review', async () => {
      let e = await createWeb(tomas, uniqueName('Stale review'));
      const stale = e.version;
      e = (await transition(tomas, e.id, 'submit', e.version).expect(200)).body;
      expect((await transition(grace, e.id, 'approve', stale).expect(409)).body.error.code).toBe('version-conflict');
      expect(((await priya.get(`/api/library/webs/${e.id}`)).body as EntryDetail).head.state).toBe('in-review');
    });

    it('when the version is missing, then 422 naming "version"', async () => {
      const e = await createWeb(tomas, uniqueName('No version'));
      const res = await tomas.put(`/api/library/webs/${e.id}`).send(webInput(e.head.name)).expect(422);
      expect(res.body.error.details.issues).toContain(jasmine.objectContaining({ field: 'version', rule: 'invalid_type' }));
    });
  });

  describe('history, diff, list and derived values', () => {
    it('when two revisions differ, then the diff names each changed value with both sides', async () => {
      const name = uniqueName('Diffed');
      let e = await createWeb(tomas, name);
      e = (await transition(tomas, e.id, 'submit', e.version)).body;
      e = (await transition(grace, e.id, 'approve', e.version)).body;
      await tomas.put(`/api/library/webs/${e.id}`).send({ ...webInput(name + ' v2', { basisWeight: pv(0.15, 'g/m^2') }), version: e.version }).expect(200);
      const diff = (await priya.get(`/api/library/webs/${e.id}/diff`).query({ from: 1, to: 2 }).expect(200)).body as RevisionDiff;
      expect(diff.changes).toContain({ path: 'name', before: name, after: name + ' v2' });
      expect(diff.changes).toContain({ path: 'data.basisWeight.si', before: 0.12, after: 0.15 });
      expect(diff.changes.map((c) => c.path)).not.toContain('data.webKind');
      await priya.get(`/api/library/webs/${e.id}/diff`).query({ from: 1, to: 1 }).expect(422);
      await priya.get(`/api/library/webs/${e.id}/diff`).query({ from: 1, to: 9 }).expect(404);
    });

    it('when listing, then paging, sorting by a figure and filtering by text and state happen on the server', async () => {
      const tag = uniqueName('Listed');
      for (const [i, bw] of [0.03, 0.09, 0.06].entries()) await createWeb(tomas, `${tag} ${i}`, { basisWeight: pv(bw, 'g/m^2') });
      const page1 = (await priya.get('/api/library/webs').query({ q: tag, sort: 'basisWeight', dir: 'desc', pageSize: 2 }).expect(200)).body as Page<EntrySummary>;
      expect(page1.total).toBe(3);
      expect(page1.items.map((i) => (i.figures['basisWeight'] as { si: number }).si)).toEqual([0.09, 0.06]);
      const page2 = (await priya.get('/api/library/webs').query({ q: tag, sort: 'basisWeight', dir: 'desc', pageSize: 2, page: 2 }).expect(200)).body as Page<EntrySummary>;
      expect(page2.items.map((i) => (i.figures['basisWeight'] as { si: number }).si)).toEqual([0.03]);
      const byName = (await priya.get('/api/library/webs').query({ q: tag, sort: 'name' }).expect(200)).body as Page<EntrySummary>;
      expect(byName.items.map((i) => i.name)).toEqual([`${tag} 0`, `${tag} 1`, `${tag} 2`]);
      const inReview = (await priya.get('/api/library/webs').query({ q: tag, state: 'in-review' }).expect(200)).body as Page<EntrySummary>;
      expect(inReview.total).toBe(0);
      const bad = await priya.get('/api/library/webs').query({ sort: 'password' }).expect(422);
      expect(bad.body.error.details.issues[0]).toEqual(jasmine.objectContaining({ field: 'sort', rule: 'enum' }));
      await priya.get('/api/library/webs').query({ pageSize: 5000 }).expect(422);
    });

    it('when a web asks for computed porosity with library fibres, then ε = 1 − BW/(ρf·t) is stored as an estimate', async () => {
      const fibre = (await tomas.post('/api/library/fibres').send(fibreInput(uniqueName('PET 6.7 dtex'), { polymer: 'PET', density: pv(1380, 'g/cm^3', 'handbook'), linearDensity: pv(6.7e-7, 'dtex') })).expect(201)).body as EntryDetail;
      const e = await createWeb(tomas, uniqueName('Computed porosity'), {
        blend: [{ fibreId: fibre.id, fibreName: fibre.head.name, massFraction: 1 }],
        basisWeight: pv(0.05, 'g/m^2'),
        thickness: pv(0.001, 'mm'),
        porosityMode: 'computed',
        porosity: undefined,
      });
      // Mass balance (exact): ε = 1 − 0.05 kg/m² / (1380 kg/m³ · 0.001 m) = 1 − 0.036232 = 0.963768.
      expect(e.head.data.porosity?.si).toBeCloseTo(1 - 0.05 / (1380 * 0.001), 12);
      expect(e.head.data.porosity?.source).toBe('estimate');
      const unlinked = await createWeb(tomas, uniqueName('Not computable'), { porosityMode: 'computed', porosity: undefined });
      expect(unlinked.head.data.porosity).toBeUndefined();
      const missing = await tomas.post('/api/library/webs').send(webInput(uniqueName('Ghost fibre'), { blend: [{ fibreId: 99999999, fibreName: 'ghost', massFraction: 1 }] })).expect(422);
      expect(missing.body.error.details.issues[0]).toEqual(jasmine.objectContaining({ field: 'data.blend.0.fibreId', rule: 'exists' }));
    });

    it('when entries change, then each step is in the audit log with its actor', async () => {
      let e = await createWeb(tomas, uniqueName('Audited'));
      e = (await transition(tomas, e.id, 'submit', e.version)).body;
      await transition(grace, e.id, 'return', e.version, 'Add the source.').expect(200);
      const [rows] = await testSequelize().query(
        `SELECT a.action, u.name FROM audit_log a JOIN users u ON u.id = a.actor_id
          WHERE a.entity_type = 'library-entry' AND a.entity_id = :id ORDER BY a.id`,
        { replacements: { id: String(e.id) } },
      );
      expect(rows).toEqual([
        { action: 'create', name: 'Tomás Lindqvist' },
        { action: 'submit', name: 'Tomás Lindqvist' },
        { action: 'return', name: 'Grace Adebayo' },
      ]);
    });
  });

  describe('e-mail notifications', () => {
    it('when a draft is submitted, then every reviewer but the submitter gets a message with a link; approve and return reach the submitter', async () => {
      const name = uniqueName('Mailed web');
      let e = await createWeb(tomas, name);
      e = (await transition(tomas, e.id, 'submit', e.version).expect(200)).body;
      const toGrace = await mail.waitFor((m) => m.subject.includes(name) && m.to.includes('grace.adebayo@brightwell.example'));
      await mail.waitFor((m) => m.subject.includes(name) && m.to.includes('lena.moreau@brightwell.example'));
      expect(toGrace.subject).toBe(`Review requested: web "${name}", revision 1`);
      expect(toGrace.text).toContain(`/materials/webs/${e.id}`);
      expect(toGrace.from).toBe('wickwright@brightwell.example');

      e = (await transition(grace, e.id, 'return', e.version, 'Please attach the pore-size distribution.').expect(200)).body;
      const returned = await mail.waitFor((m) => m.subject.startsWith('Returned:') && m.subject.includes(name));
      expect(returned.to).toEqual(['tomas.lindqvist@brightwell.example']);
      expect(returned.text).toContain('Please attach the pore-size distribution.');

      e = (await tomas.put(`/api/library/webs/${e.id}`).send({ ...webInput(name), version: e.version }).expect(200)).body;
      e = (await transition(tomas, e.id, 'submit', e.version).expect(200)).body;
      await transition(grace, e.id, 'approve', e.version, 'Thanks.').expect(200);
      const approved = await mail.waitFor((m) => m.subject.startsWith('Approved:') && m.subject.includes(name));
      expect(approved.to).toEqual(['tomas.lindqvist@brightwell.example']);
      // No review request ever went to the submitter or to people without the reviewer role.
      const all = mail.withSubject(name);
      expect(all.filter((m) => m.subject.startsWith('Review requested')).flatMap((m) => m.to).sort()).toEqual([
        'grace.adebayo@brightwell.example',
        'grace.adebayo@brightwell.example',
        'lena.moreau@brightwell.example',
        'lena.moreau@brightwell.example',
      ]);
    });

    it('when an administrator opens the dev mailbox, then the messages are there; others get 403', async () => {
      const name = uniqueName('Mailbox web');
      const e = await createWeb(tomas, name);
      await transition(tomas, e.id, 'submit', e.version).expect(200);
      await mail.waitFor((m) => m.subject.includes(name));
      const box = await ada.get('/api/dev/mailbox').expect(200);
      expect(box.body.available).toBeTrue();
      expect((box.body.messages as { subject: string }[]).some((m) => m.subject.includes(name))).toBeTrue();
      await grace.get('/api/dev/mailbox').expect(403);
      await tomas.get('/api/dev/mailbox').expect(403);
    });
  });

  it('when the OpenAPI document is fetched, then it lists the library routes with their schemas', async () => {
    const doc = (await request(app).get('/api/docs').expect(200)).body as { openapi: string; paths: Record<string, Record<string, unknown>>; components: { schemas: Record<string, unknown> } };
    expect(doc.openapi).toBe('3.1.0');
    expect(Object.keys(doc.paths['/api/library/webs/{id}'])).toEqual(jasmine.arrayContaining(['get', 'put']));
    expect(doc.paths['/api/library/webs/{id}/approve']['post']).toBeDefined();
    expect(doc.paths['/api/library/webs/{id}/psd']['post']).toBeDefined();
    expect(doc.components.schemas['WebData']).toBeDefined();
  });
});
