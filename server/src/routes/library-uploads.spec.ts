import { createHash } from 'node:crypto';
import type { Express } from 'express';
import type { EntryDetail, UploadPreview, WebData } from 'wick-core';
import { createWeb, transition, uniqueName } from '../../test/library';
import { startTestMailbox, type TestMailbox } from '../../test/mail';
import { signInAs, type Agent } from '../../test/sign-in';
import { testApp, testSequelize } from '../../test/test-app';
import { UPLOAD_LIMITS } from '../services/library-uploads';

/** Rows in the upload tables: a refused file must leave these unchanged. */
async function stored(): Promise<{ files: number; uploads: number; entries: number }> {
  const [[row]] = (await testSequelize().query(
    `SELECT (SELECT count(*) FROM library_files)::int AS files, (SELECT count(*) FROM library_uploads)::int AS uploads,
            (SELECT count(*) FROM library_entries)::int AS entries`,
  )) as [{ files: number; uploads: number; entries: number }[], unknown];
  return row;
}

const sha256 = (b: Buffer) => createHash('sha256').update(b).digest('hex');

describe('library uploads: pore-size distributions, lab curves and bulk web import', () => {
  let app: Express;
  let tomas: Agent, lena: Agent, grace: Agent, priya: Agent;
  let mail: TestMailbox;
  afterAll(async () => mail.stop());

  /** The test database has no demo data: a supplier of our own for the import. */
  const supplier = uniqueName('Hollow Creek Nonwovens');

  beforeAll(async () => {
    mail = await startTestMailbox();
    await testSequelize().query('INSERT INTO suppliers (name, country, created_at, updated_at) VALUES (:supplier, :country, now(), now())', { replacements: { supplier, country: 'Fictland' } });
    app = testApp({ auth: { signInRateLimit: { windowMs: 60_000, limit: 10_000 } } });
    [tomas, lena, grace, priya] = await Promise.all(['materials-scientist', 'lena', 'reviewer', 'engineer'].map(async (w) => (await signInAs(app, w)).agent));
  });

  function upload(agent: Agent, path: string, content: Buffer | string, fileName = 'data.csv', fields: Record<string, string> = {}) {
    const req = agent.post(path);
    for (const [k, v] of Object.entries(fields)) req.field(k, v);
    return req.attach('file', Buffer.isBuffer(content) ? content : Buffer.from(content, 'utf8'), { filename: fileName, contentType: 'text/csv' });
  }

  describe('pore-size distribution', () => {
    const psd = ['# porometer run 12, sample B', 'diameter (µm),cumulative finer (%)', '10,5', '20,25', '40,60', '80,90', '160,100', ''].join('\n');

    it('when a good CSV is uploaded, then a preview in SI; on commit the draft holds it with the file checksum', async () => {
      const web = await createWeb(tomas, uniqueName('PSD web'));
      const res = await upload(tomas, `/api/library/webs/${web.id}/psd`, psd, 'run-12.csv').expect(201);
      const p = res.body as UploadPreview;
      expect(p.file).toEqual(jasmine.objectContaining({ fileName: 'run-12.csv', encoding: 'utf-8', delimiter: ',', rows: 5, sha256: sha256(Buffer.from(psd)) }));
      if (p.preview.purpose !== 'psd') throw new Error('wrong purpose');
      expect(p.preview.psd.form).toBe('cumulative-finer');
      expect(p.preview.psd.diameterUnit).toBe('um');
      // 10 µm = 1e-5 m (SI definition of the micrometre); 5 % = 0.05.
      expect(p.preview.psd.diameters[0]).toBeCloseTo(1e-5, 15);
      expect(p.preview.psd.fractions).toEqual([0.05, 0.25, 0.6, 0.9, 1]);
      // Not applied yet.
      expect(((await tomas.get(`/api/library/webs/${web.id}`)).body as EntryDetail<WebData>).head.data.poreSizeDistribution).toBeUndefined();

      const done = await tomas.post(`/api/library/uploads/${p.uploadId}/commit`).send({ version: web.version }).expect(200);
      expect(done.body).toEqual({ purpose: 'psd', entryIds: [web.id] });
      const after = (await tomas.get(`/api/library/webs/${web.id}`)).body as EntryDetail<WebData>;
      expect(after.version).toBe(web.version + 1);
      expect(after.head.data.poreSizeDistribution?.fractions).toEqual([0.05, 0.25, 0.6, 0.9, 1]);
      expect(after.head.data.poreSizeDistribution?.file?.sha256).toBe(p.file.sha256);
      // The original bytes are kept and served back unchanged.
      const file = await priya.get(`/api/library/files/${after.head.data.poreSizeDistribution!.file!.fileId}`).responseType('blob').expect(200);
      expect(sha256(file.body as Buffer)).toBe(p.file.sha256);
      expect(file.headers['x-content-sha256']).toBe(p.file.sha256);
      // A preview is applied once.
      expect((await tomas.post(`/api/library/uploads/${p.uploadId}/commit`).send({ version: after.version }).expect(409)).body.error.code).toBe('upload-done');
    });

    it('when the file is Windows-1252 with semicolons, decimal commas and the largest pore first, then it is read all the same', async () => {
      const web = await createWeb(tomas, uniqueName('Latin-1 PSD'));
      const text = 'Durchmesser (µm);Differential (%)\r\n80;10\r\n40;40\r\n20;35,5\r\n10;14,5\r\n';
      const bytes = Buffer.from(text, 'latin1');
      const res = await upload(tomas, `/api/library/webs/${web.id}/psd`, bytes).expect(201);
      const p = res.body as UploadPreview;
      expect(p.file.encoding).toBe('windows-1252');
      expect(p.file.delimiter).toBe(';');
      if (p.preview.purpose !== 'psd') throw new Error('wrong purpose');
      expect(p.preview.psd.form).toBe('differential');
      expect(p.preview.psd.diameters.map((d) => Math.round(d * 1e6))).toEqual([10, 20, 40, 80]);
      expect(p.preview.psd.fractions).toEqual([0.145, 0.355, 0.4, 0.1]);
      expect(p.warnings.map((w) => w.message).join(' ')).toContain('largest diameter');
    });

    it('when rows are bad, then 422 lists every problem with its line and nothing is stored', async () => {
      const web = await createWeb(tomas, uniqueName('Bad PSD'));
      const before = await stored();
      const bad = ['diameter (µm),cumulative finer (%)', '10,5', '20,abc', '40,30', '30,60', '80,250', ''].join('\n');
      const res = await upload(tomas, `/api/library/webs/${web.id}/psd`, bad).expect(422);
      expect(res.body.error.code).toBe('upload-invalid');
      const issues = res.body.error.details.issues as { line: number; message: string }[];
      expect(issues.map((i) => i.line)).toEqual([3, 6]);
      expect(issues[0].message).toContain('"abc" is not a number');
      expect(issues[1].message).toContain('outside 0–1');
      expect(res.body.error.message).toContain('Nothing was changed');
      expect(await stored()).toEqual(before);
    });

    it('when the header unit is of the wrong kind or missing, then 422 on line 1 and nothing is stored', async () => {
      const web = await createWeb(tomas, uniqueName('Wrong units'));
      const before = await stored();
      const wrongKind = await upload(tomas, `/api/library/webs/${web.id}/psd`, 'diameter (kPa),cumulative finer (%)\n10,50\n20,100\n').expect(422);
      expect(wrongKind.body.error.details.issues[0]).toEqual(jasmine.objectContaining({ line: 1, column: 'diameter (kPa)' }));
      expect(wrongKind.body.error.details.issues[0].message).toContain('not a unit of a length');
      const unknown = await upload(tomas, `/api/library/webs/${web.id}/psd`, 'diameter (furlong-ish),finer (%)\n10,50\n20,100\n').expect(422);
      expect(unknown.body.error.details.issues[0].line).toBe(1);
      const none = await upload(tomas, `/api/library/webs/${web.id}/psd`, 'diameter,finer (%)\n10,50\n20,100\n').expect(422);
      expect(none.body.error.details.issues[0].message).toContain('Put the unit in the header');
      const percentLike = await upload(tomas, `/api/library/webs/${web.id}/psd`, 'diameter (um),cumulative finer\n10,50\n20,100\n').expect(422);
      expect(percentLike.body.error.details.issues[0].message).toContain('write (%) in the header');
      expect(await stored()).toEqual(before);
    });

    it('when the file is binary (a spreadsheet), then 415 and nothing is stored', async () => {
      const web = await createWeb(tomas, uniqueName('Binary'));
      const before = await stored();
      const xlsx = Buffer.concat([Buffer.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00]), Buffer.alloc(200, 7)]);
      const res = await upload(tomas, `/api/library/webs/${web.id}/psd`, xlsx, 'psd.xlsx').expect(415);
      expect(res.body.error.code).toBe('binary-file');
      expect(res.body.error.message).toContain('Excel');
      const nul = await upload(tomas, `/api/library/webs/${web.id}/psd`, Buffer.from('diameter (um)\u0000,x\n', 'utf8')).expect(415);
      expect(nul.body.error.code).toBe('binary-file');
      expect(await stored()).toEqual(before);
    });

    it('when the file is larger than the limit, then 413 and nothing is stored', async () => {
      const web = await createWeb(tomas, uniqueName('Oversized'));
      const before = await stored();
      const line = '12.5,0.5\n';
      const big = 'diameter (um),differential\n' + line.repeat(Math.ceil((UPLOAD_LIMITS.maxBytes + 10) / line.length));
      const res = await upload(tomas, `/api/library/webs/${web.id}/psd`, big).expect(413);
      expect(res.body.error.code).toBe('file-too-large');
      expect(await stored()).toEqual(before);
    });

    it('when the web is in review, then uploads wait (409); an engineer may not upload (403)', async () => {
      let web = await createWeb(tomas, uniqueName('Locked'));
      await upload(priya, `/api/library/webs/${web.id}/psd`, psd).expect(403);
      web = (await transition(tomas, web.id, 'submit', web.version).expect(200)).body;
      expect((await upload(tomas, `/api/library/webs/${web.id}/psd`, psd).expect(409)).body.error.code).toBe('wrong-state');
    });

    it('when the web changed after the preview, then the commit answers 409 and changes nothing', async () => {
      const web = await createWeb(tomas, uniqueName('Moving target'));
      const p = (await upload(tomas, `/api/library/webs/${web.id}/psd`, psd).expect(201)).body as UploadPreview;
      const moved = await tomas.put(`/api/library/webs/${web.id}`).send({ name: web.head.name + ' b', supplierId: null, notes: '', data: web.head.data, version: web.version }).expect(200);
      const res = await tomas.post(`/api/library/uploads/${p.uploadId}/commit`).send({ version: web.version }).expect(409);
      expect(res.body.error.code).toBe('version-conflict');
      const now = (await tomas.get(`/api/library/webs/${web.id}`)).body as EntryDetail<WebData>;
      expect(now.version).toBe(moved.body.version);
      expect(now.head.data.poreSizeDistribution).toBeUndefined();
      // Someone else's preview is not theirs to commit or see.
      await lena.post(`/api/library/uploads/${p.uploadId}/commit`).send({ version: now.version }).expect(404);
      await lena.get(`/api/library/uploads/${p.uploadId}`).expect(404);
      // Discarding removes the preview and its file.
      const before = await stored();
      await tomas.delete(`/api/library/uploads/${p.uploadId}`).expect(204);
      expect(await stored()).toEqual({ ...before, files: before.files - 1, uploads: before.uploads - 1 });
    });

    it('when the web is approved, then committing a distribution starts a new draft revision', async () => {
      let web = await createWeb(tomas, uniqueName('Approved PSD'));
      web = (await transition(tomas, web.id, 'submit', web.version)).body;
      web = (await transition(grace, web.id, 'approve', web.version)).body;
      const p = (await upload(tomas, `/api/library/webs/${web.id}/psd`, psd).expect(201)).body as UploadPreview;
      await tomas.post(`/api/library/uploads/${p.uploadId}/commit`).send({ version: web.version }).expect(200);
      const after = (await tomas.get(`/api/library/webs/${web.id}`)).body as EntryDetail<WebData>;
      expect(after.head.number).toBe(2);
      expect(after.head.state).toBe('draft');
      expect(after.head.data.poreSizeDistribution).toBeDefined();
      expect(after.approved?.number).toBe(1);
      expect((after.approved?.data as WebData).poreSizeDistribution).toBeUndefined();
    });
  });

  describe('lab curve', () => {
    it('when a height curve is uploaded and committed, then the web carries it in SI; uploading it again replaces it', async () => {
      const web = await createWeb(tomas, uniqueName('Curve web'));
      const csv = 'time (min)\theight (mm)\n0\t0\n0.5\t12\n1\t17.5\n2\t24\n';
      const p = (await upload(tomas, `/api/library/webs/${web.id}/curves`, csv, 'wick.tsv', { name: 'Vertical wicking, saline', liquid: '0.9 % NaCl saline' }).expect(201)).body as UploadPreview;
      expect(p.file.delimiter).toBe('tab');
      if (p.preview.purpose !== 'curve') throw new Error('wrong purpose');
      expect(p.preview.curve.measurement).toBe('height');
      // 0.5 min = 30 s; 12 mm = 0.012 m (unit definitions).
      expect(p.preview.curve.times).toEqual([0, 30, 60, 120]);
      expect(p.preview.curve.values[1]).toBeCloseTo(0.012, 12);
      await tomas.post(`/api/library/uploads/${p.uploadId}/commit`).send({ version: web.version }).expect(200);
      let now = (await tomas.get(`/api/library/webs/${web.id}`)).body as EntryDetail<WebData>;
      expect(now.head.data.curves.length).toBe(1);
      const again = (await upload(tomas, `/api/library/webs/${web.id}/curves`, 'time (s),height (cm)\n0,0\n60,2\n', 'rerun.csv', { name: 'Vertical wicking, saline' }).expect(201)).body as UploadPreview;
      await tomas.post(`/api/library/uploads/${again.uploadId}/commit`).send({ version: now.version }).expect(200);
      now = (await tomas.get(`/api/library/webs/${web.id}`)).body as EntryDetail<WebData>;
      expect(now.head.data.curves.length).toBe(1);
      expect(now.head.data.curves[0].values).toEqual([0, 0.02]);
      expect(now.head.data.curves[0].file?.fileName).toBe('rerun.csv');
    });

    it('when times go backwards or the value unit is neither length nor mass, then 422 with lines', async () => {
      const web = await createWeb(tomas, uniqueName('Bad curve'));
      const back = await upload(tomas, `/api/library/webs/${web.id}/curves`, 'time (s),mass (g)\n0,0\n10,1\n5,2\n', 'c.csv', { name: 'x' }).expect(422);
      expect(back.body.error.details.issues[0].line).toBe(4);
      const unit = await upload(tomas, `/api/library/webs/${web.id}/curves`, 'time (s),flow (mL/s)\n0,0\n10,1\n', 'c.csv', { name: 'x' }).expect(422);
      expect(unit.body.error.details.issues[0].line).toBe(1);
      const noName = await upload(tomas, `/api/library/webs/${web.id}/curves`, 'time (s),mass (g)\n0,0\n10,1\n').expect(422);
      expect(noName.body.error.details.issues[0].field).toBe('name');
    });
  });

  describe('bulk web import', () => {
    it('when every row is good, then the preview lists the webs and the commit creates them all as drafts', async () => {
      const tag = uniqueName('Imported');
      const csv = [
        'name,supplier,kind,fibres,basis weight (g/m²),thickness (mm),thickness pressure (kPa),porosity (%),mean flow pore size (µm),source',
        `"${tag} ADL",${supplier},carded through-air bonded,PET 6.7 dtex 60% + PE/PET bico 40%,40,1.2,0.5,95,85,supplier datasheet`,
        `"${tag} top",${supplier},spunbond,PP 2.2 dtex,12,0.15,0.5,,30,measured`,
      ].join('\n');
      const before = await stored();
      const p = (await upload(tomas, '/api/library/webs/import', csv, 'webs.csv').expect(201)).body as UploadPreview;
      if (p.preview.purpose !== 'web-import') throw new Error('wrong purpose');
      expect(p.preview.webs.map((w) => w.line)).toEqual([2, 3]);
      const adl = p.preview.webs[0].input;
      expect(adl.data.webKind).toBe('carded-through-air-bonded');
      expect(adl.data.blend).toEqual([
        { fibreName: 'PET 6.7 dtex', massFraction: 0.6 },
        { fibreName: 'PE/PET bico', massFraction: 0.4 },
      ]);
      // 40 g/m² = 0.04 kg/m²; 95 % = 0.95; 0.5 kPa = 500 Pa.
      expect(adl.data.basisWeight).toEqual({ si: 0.04, unit: 'g/m^2', source: 'supplier-datasheet' });
      expect(adl.data.porosity?.si).toBeCloseTo(0.95, 12);
      expect(adl.data.thicknessPressure?.si).toBeCloseTo(500, 9);
      expect(p.preview.webs[1].input.data.porosityMode).toBe('computed');
      expect((await stored()).entries).toBe(before.entries);

      const done = await tomas.post(`/api/library/uploads/${p.uploadId}/commit`).send({}).expect(200);
      expect(done.body.entryIds.length).toBe(2);
      const list = await priya.get('/api/library/webs').query({ q: tag, sort: 'name' }).expect(200);
      expect(list.body.items.map((i: { name: string; state: string }) => [i.name, i.state])).toEqual([
        [`${tag} ADL`, 'draft'],
        [`${tag} top`, 'draft'],
      ]);
      expect(list.body.items[0].supplier.name).toBe(supplier);
    });

    it('when one row of many is bad, then nothing is imported and each bad row is named by line', async () => {
      const tag = uniqueName('Half good');
      const csv = [
        'name;kind;fibres;basis weight (g/m²);thickness (mm);thickness pressure (kPa)',
        `${tag} a;airlaid;Fluff pulp;150;2,1;0,5`,
        `${tag} b;moonwoven;Fluff pulp;150;2,1;0,5`,
        `${tag} c;airlaid;PP 50% + PET 30%;150;2,1;0,5`,
        `${tag} d;airlaid;Fluff pulp;150;2,1;`,
      ].join('\n');
      const before = await stored();
      const res = await upload(tomas, '/api/library/webs/import', csv).expect(422);
      const issues = res.body.error.details.issues as { line: number; column?: string; message: string }[];
      expect(issues.map((i) => i.line)).toEqual([3, 4, 5]);
      expect(issues[0].message).toContain('Unknown kind');
      expect(issues[1].column).toBe('blend');
      expect(issues[2].column).toBe('thicknessPressure');
      expect(await stored()).toEqual(before);
      expect((await priya.get('/api/library/webs').query({ q: tag })).body.total).toBe(0);
    });

    it('when the basis weight column has a length unit, then 422 on the header line', async () => {
      const res = await upload(tomas, '/api/library/webs/import', 'name,kind,fibres,basis weight (mm)\nx,airlaid,pulp,3\n').expect(422);
      expect(res.body.error.details.issues).toEqual([jasmine.objectContaining({ line: 1, column: 'basis weight (mm)' })]);
    });

    it('when there are more rows than allowed, then 422 and nothing is stored', async () => {
      const before = await stored();
      const rows = Array.from({ length: UPLOAD_LIMITS.maxRows['web-import'] + 1 }, (_, i) => `w${i},airlaid,pulp,100`);
      const res = await upload(tomas, '/api/library/webs/import', ['name,kind,fibres,basis weight (g/m2)', ...rows].join('\n')).expect(422);
      expect(res.body.error.details.issues[0].message).toContain('Too many rows');
      expect(await stored()).toEqual(before);
    });

    it('when no file is attached, then 422 "upload-invalid"', async () => {
      const res = await tomas.post('/api/library/webs/import').field('x', '1').expect(422);
      expect(res.body.error.code).toBe('upload-invalid');
    });
  });
});
