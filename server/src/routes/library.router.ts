import { type RequestHandler, Router } from 'express';
import multer from 'multer';
import { z } from 'zod';
import {
  BUILT_IN_LIQUIDS,
  type BuiltInLiquidRow,
  LIBRARY_COLLECTION,
  LIBRARY_KINDS,
  type LibraryKind,
  liquidAt,
  ZERO_CELSIUS,
} from 'wick-core';
import type { AppDeps } from '../app';
import type { SessionUser } from '../auth/authorize';
import { AppError } from '../errors';
import { loadMailConfig } from '../mail/mail-config';
import { mailOutbox } from '../mail/outbox';
import { documentedRoutes, type DocumentedRoute } from '../openapi/documented-routes';
import {
  allEntriesQuerySchema,
  curveUploadFieldsSchema,
  deleteDraftQuerySchema,
  diffQuerySchema,
  diffSchema,
  entryDetailSchema,
  entryPageSchema,
  idParamsSchema,
  listQuerySchema,
  psdUploadFieldsSchema,
  returnSchema,
  revisionInputSchema,
  revisionParamsSchema,
  revisionSchema,
  revisionSummarySchema,
  revisionUpdateSchema,
  transitionSchema,
  uploadCommitResultSchema,
  uploadCommitSchema,
  uploadPreviewSchema,
} from '../schemas/library';
import {
  approveEntry,
  createEntry,
  deleteDraft,
  diffRevisions,
  getEntry,
  getRevision,
  libraryContext,
  listEntries,
  listRevisions,
  listSuppliers,
  returnEntry,
  submitEntry,
  updateEntry,
} from '../services/library';
import { commitUpload, discardUpload, fileContent, getUpload, previewUpload, UPLOAD_LIMITS, type UploadRequest } from '../services/library-uploads';

const user = (res: { locals: Record<string, unknown> }) => res.locals['user'] as SessionUser;
const params = <T>(res: { locals: Record<string, unknown> }) => res.locals['params'] as T;
const query = <T>(res: { locals: Record<string, unknown> }) => res.locals['query'] as T;
const body = <T>(res: { locals: Record<string, unknown> }) => res.locals['body'] as T;

type Id = z.output<typeof idParamsSchema>;

const TITLES: Record<LibraryKind, string> = { fibre: 'Fibres', web: 'Webs', liquid: 'Liquids' };

/** Multer keeps the file in memory (bounded by the size limit); its errors become our error envelope. */
function receiveFile(): RequestHandler {
  const single = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: UPLOAD_LIMITS.maxBytes, files: 1, fields: 10, fieldSize: 4000 },
  }).single('file');
  return (req, res, next) => {
    single(req, res, (err: unknown) => {
      if (!err) {
        if (!req.file) return next(new AppError(422, 'upload-invalid', 'Attach the CSV file in the form field "file".', { issues: [{ line: null, message: 'No file was sent.' }] }));
        return next();
      }
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') {
          return next(
            new AppError(413, 'file-too-large', `The file is larger than ${Math.round(UPLOAD_LIMITS.maxBytes / 1024)} KiB, the most accepted. Nothing was stored.`, {
              issues: [{ line: null, message: `Files up to ${Math.round(UPLOAD_LIMITS.maxBytes / 1024)} KiB are accepted.` }],
            }),
          );
        }
        return next(new AppError(422, 'upload-invalid', `The upload could not be read: ${err.message}.`, { issues: [{ line: null, message: err.message }] }));
      }
      next(err);
    });
  };
}

function uploadedFile(req: Parameters<RequestHandler>[0]) {
  const f = req.file!;
  // Browsers send UTF-8 file names; busboy reads them as Latin-1.
  const fileName = Buffer.from(f.originalname, 'latin1').toString('utf8');
  return { fileName, mediaType: f.mimetype, bytes: f.buffer };
}

const fileField = z.string().meta({ format: 'binary', description: 'The CSV file (UTF-8, UTF-16 with BOM or Windows-1252; comma, semicolon, tab or | separated).' });

function kindRoutes(kind: LibraryKind, ctx: ReturnType<typeof libraryContext>): DocumentedRoute[] {
  const tags = [TITLES[kind]];
  const detail = entryDetailSchema(kind);
  const word = kind;
  return [
    {
      method: 'get',
      path: '/',
      access: 'library:read',
      summary: `List ${word}s (newest revision of each), paged, sorted and filtered on the server`,
      tags,
      query: listQuerySchema,
      responses: { 200: { description: 'One page of entries.', schema: entryPageSchema } },
      handler: async (_req, res) => {
        res.json(await listEntries(ctx, kind, { ...query<z.output<typeof listQuerySchema>>(res), kind: undefined }));
      },
    },
    {
      method: 'post',
      path: '/',
      access: 'library:edit',
      summary: `Create a ${word} (revision 1, a draft)`,
      tags,
      body: revisionInputSchema(kind),
      responses: { 201: { description: 'The new entry.', schema: detail } },
      handler: async (_req, res) => {
        res.status(201).json(await createEntry(ctx, kind, body(res), user(res)));
      },
    },
    {
      method: 'get',
      path: '/:id',
      access: 'library:read',
      summary: `Read a ${word}: newest revision, the approved one in force, the history and what you may do`,
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'The entry.', schema: detail }, 404: { description: 'No such entry.' } },
      handler: async (_req, res) => {
        res.json(await getEntry(ctx, kind, params<Id>(res).id, user(res)));
      },
    },
    {
      method: 'put',
      path: '/:id',
      access: 'library:edit',
      summary: `Save a ${word}: changes the draft, or starts a new draft revision when the newest is approved`,
      description: '`version` is the entry version the edit is based on; a stale one answers 409 with `details.current`.',
      tags,
      params: idParamsSchema,
      body: revisionUpdateSchema(kind),
      responses: {
        200: { description: 'The entry after the change.', schema: detail },
        409: { description: 'Stale version (`version-conflict`, with the current entry) or in review (`wrong-state`).' },
      },
      handler: async (_req, res) => {
        res.json(await updateEntry(ctx, kind, params<Id>(res).id, body(res), user(res)));
      },
    },
    {
      method: 'post',
      path: '/:id/submit',
      access: 'library:edit',
      summary: `Submit the ${word}'s draft for review (e-mails every reviewer)`,
      tags,
      params: idParamsSchema,
      body: transitionSchema,
      responses: { 200: { description: 'The entry, now in review.', schema: detail }, 409: { description: 'Stale version or not a draft.' } },
      handler: async (_req, res) => {
        res.json(await submitEntry(ctx, kind, params<Id>(res).id, body<z.output<typeof transitionSchema>>(res).version, user(res)));
      },
    },
    {
      method: 'post',
      path: '/:id/approve',
      access: 'library:review',
      summary: `Approve the ${word} revision in review (four-eyes; e-mails the submitter)`,
      tags,
      params: idParamsSchema,
      body: transitionSchema,
      responses: {
        200: { description: 'The entry; the approved revision is now in force.', schema: detail },
        403: { description: 'Four-eyes: you created, edited or submitted this revision (`four-eyes`).' },
        409: { description: 'Stale version or not in review.' },
      },
      handler: async (_req, res) => {
        const b = body<z.output<typeof transitionSchema>>(res);
        res.json(await approveEntry(ctx, kind, params<Id>(res).id, b.version, b.comment, user(res)));
      },
    },
    {
      method: 'post',
      path: '/:id/return',
      access: 'library:review',
      summary: `Return the ${word} revision in review with a comment (four-eyes; e-mails the submitter)`,
      tags,
      params: idParamsSchema,
      body: returnSchema,
      responses: {
        200: { description: 'The entry, returned.', schema: detail },
        403: { description: 'Four-eyes.' },
        409: { description: 'Stale version or not in review.' },
      },
      handler: async (_req, res) => {
        const b = body<z.output<typeof returnSchema>>(res);
        res.json(await returnEntry(ctx, kind, params<Id>(res).id, b.version, b.comment, user(res)));
      },
    },
    {
      method: 'delete',
      path: '/:id/draft',
      access: 'library:edit',
      summary: `Delete the ${word}'s draft revision (only drafts); an entry with nothing else goes with it`,
      tags,
      params: idParamsSchema,
      query: deleteDraftQuerySchema,
      responses: {
        200: {
          description: 'What remains: the entry, or null when it was deleted.',
          schema: z.object({ entry: detail.nullable() }),
        },
        409: { description: 'Stale version or not a draft.' },
      },
      handler: async (_req, res) => {
        res.json({ entry: await deleteDraft(ctx, kind, params<Id>(res).id, query<z.output<typeof deleteDraftQuerySchema>>(res).version, user(res)) });
      },
    },
    {
      method: 'get',
      path: '/:id/revisions',
      access: 'library:read',
      summary: `Revision history of a ${word}, newest first`,
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'Revisions.', schema: z.array(revisionSummarySchema) } },
      handler: async (_req, res) => {
        res.json(await listRevisions(ctx, kind, params<Id>(res).id));
      },
    },
    {
      method: 'get',
      path: '/:id/revisions/:number',
      access: 'library:read',
      summary: `One revision of a ${word}, with its data`,
      tags,
      params: revisionParamsSchema,
      responses: { 200: { description: 'The revision.', schema: revisionSchema(kind) } },
      handler: async (_req, res) => {
        const p = params<z.output<typeof revisionParamsSchema>>(res);
        res.json(await getRevision(ctx, kind, p.id, p.number));
      },
    },
    {
      method: 'get',
      path: '/:id/diff',
      access: 'library:read',
      summary: `What changed between two revisions of a ${word}`,
      tags,
      params: idParamsSchema,
      query: diffQuerySchema,
      responses: { 200: { description: 'Changed values by path.', schema: diffSchema } },
      handler: async (_req, res) => {
        const q = query<z.output<typeof diffQuerySchema>>(res);
        res.json(await diffRevisions(ctx, kind, params<Id>(res).id, q.from, q.to));
      },
    },
  ];
}

function uploadRoutes(ctx: ReturnType<typeof libraryContext>): DocumentedRoute[] {
  const tags = ['Uploads'];
  const preview = { 201: { description: 'Every row is good: a preview to commit or discard.', schema: uploadPreviewSchema } };
  const refusals = {
    413: { description: 'File larger than the limit (`file-too-large`); nothing stored.' },
    415: { description: 'Not a text file (`binary-file`); nothing stored.' },
    422: { description: 'Problems with line numbers in `details.issues` (`upload-invalid`); nothing stored.' },
  };
  return [
    {
      method: 'post',
      path: '/webs/:id/psd',
      access: 'library:edit',
      summary: 'Upload a pore-size distribution CSV for a web (preview)',
      description:
        'Columns: diameter with its unit ("diameter (µm)"), then the fraction in % or 0–1, named "differential", "cumulative finer" or "cumulative coarser" (or give `form`).',
      tags,
      before: [receiveFile(), (req, res, next) => validateFields(psdUploadFieldsSchema, req, res, next)],
      params: idParamsSchema,
      multipart: psdUploadFieldsSchema.extend({ file: fileField }),
      responses: { ...preview, ...refusals },
      handler: async (req, res) => {
        const f = res.locals['fields'] as z.output<typeof psdUploadFieldsSchema>;
        const request: UploadRequest = { purpose: 'psd', entryId: params<Id>(res).id, form: f.form, source: f.source };
        res.status(201).json(await previewUpload(ctx, request, uploadedFile(req), user(res)));
      },
    },
    {
      method: 'post',
      path: '/webs/:id/curves',
      access: 'library:edit',
      summary: 'Upload a lab wicking curve CSV for a web (preview)',
      description: 'Columns: time with its unit ("time (s)"), then height ("height (mm)") or mass ("mass (g)").',
      tags,
      before: [receiveFile(), (req, res, next) => validateFields(curveUploadFieldsSchema, req, res, next)],
      params: idParamsSchema,
      multipart: curveUploadFieldsSchema.extend({ file: fileField }),
      responses: { ...preview, ...refusals },
      handler: async (req, res) => {
        const f = res.locals['fields'] as z.output<typeof curveUploadFieldsSchema>;
        const request: UploadRequest = { purpose: 'curve', entryId: params<Id>(res).id, name: f.name, measurement: f.measurement, liquid: f.liquid };
        res.status(201).json(await previewUpload(ctx, request, uploadedFile(req), user(res)));
      },
    },
    {
      method: 'post',
      path: '/webs/import',
      access: 'library:edit',
      summary: 'Upload a CSV of webs to create as drafts (preview)',
      description:
        'Columns: name, kind, fibres ("PP 1.7 dtex 70% + PET 30%"), basis weight (unit); optional supplier, thickness (unit), ' +
        'thickness pressure (unit), porosity (% or 0–1), mean flow pore size (unit), permeability in plane / through plane (unit), source, notes.',
      tags,
      before: [receiveFile()],
      multipart: z.object({ file: fileField }),
      responses: { ...preview, ...refusals },
      handler: async (req, res) => {
        res.status(201).json(await previewUpload(ctx, { purpose: 'web-import' }, uploadedFile(req), user(res)));
      },
    },
    {
      method: 'get',
      path: '/uploads/:id',
      access: 'library:edit',
      summary: 'Read your upload preview again',
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'The preview.', schema: uploadPreviewSchema }, 410: { description: 'Expired.' } },
      handler: async (_req, res) => {
        res.json(await getUpload(ctx, params<Id>(res).id, user(res)));
      },
    },
    {
      method: 'post',
      path: '/uploads/:id/commit',
      access: 'library:edit',
      summary: 'Apply your upload preview, all of it or nothing',
      description: 'For a distribution or curve, `version` is the web version the upload is meant for (409 when stale).',
      tags,
      params: idParamsSchema,
      body: uploadCommitSchema,
      responses: { 200: { description: 'What changed.', schema: uploadCommitResultSchema }, 409: { description: 'Stale version or already done.' }, 410: { description: 'Expired.' } },
      handler: async (_req, res) => {
        res.json(await commitUpload(ctx, params<Id>(res).id, body<z.output<typeof uploadCommitSchema>>(res).version, user(res)));
      },
    },
    {
      method: 'delete',
      path: '/uploads/:id',
      access: 'library:edit',
      summary: 'Discard your upload preview (its file goes too)',
      tags,
      params: idParamsSchema,
      responses: { 204: { description: 'Discarded.' } },
      handler: async (_req, res) => {
        await discardUpload(ctx, params<Id>(res).id, user(res));
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/files/:id',
      access: 'library:read',
      summary: 'Download an uploaded file exactly as it was sent (SHA-256 in the X-Content-SHA256 header)',
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'The original bytes.', schema: z.string().meta({ format: 'binary' }), contentType: 'application/octet-stream' } },
      handler: async (_req, res) => {
        const f = await fileContent(ctx, params<Id>(res).id);
        res.setHeader('Content-Type', f.mediaType.startsWith('text/') ? `${f.mediaType}` : 'application/octet-stream');
        res.setHeader('Content-Disposition', `attachment; filename*=UTF-8''${encodeURIComponent(f.fileName)}`);
        res.setHeader('X-Content-SHA256', f.sha256);
        res.send(f.content);
      },
    },
  ];
}

function validateFields(schema: z.ZodObject, req: Parameters<RequestHandler>[0], res: Parameters<RequestHandler>[1], next: Parameters<RequestHandler>[2]): void {
  const r = schema.safeParse(req.body ?? {});
  if (!r.success) {
    const issues = r.error.issues.map((i) => ({ field: i.path.join('.'), rule: i.code, message: i.message }));
    return next(new AppError(422, 'validation-failed', `Invalid form fields: ${issues[0].field} — ${issues[0].message}`, { issues }));
  }
  res.locals['fields'] = r.data;
  next();
}

/** Built-in liquids (read-only) at 20 °C, from wick-core. */
function builtInLiquids(): BuiltInLiquidRow[] {
  const T = ZERO_CELSIUS + 20;
  return BUILT_IN_LIQUIDS.map((l) => {
    const p = liquidAt(l.id, T);
    return {
      id: l.id,
      name: l.name,
      flammable: l.flammable,
      validRange: l.validRange,
      temperature: T,
      surfaceTension: p.surfaceTension,
      viscosity: p.viscosity,
      density: p.density,
      sources: p.sources,
      remarks: [...new Set(p.warnings.map((w) => w.message))],
    };
  });
}

/** `/api/library/…`: fibres, webs and liquids with revisions and review, uploads, suppliers and built-in liquids. */
export function libraryRouter(deps: AppDeps): Router {
  const mail = loadMailConfig(deps.config.publicUrl);
  const ctx = libraryContext(deps.sequelize, mailOutbox(deps.sequelize, mail, { flushOnStart: deps.config.env !== 'test' }));
  const router = Router();
  const mount = '/api/library';
  // Fixed paths before `/:collection/:id` so "import" is never read as an id.
  documentedRoutes(router, mount, uploadRoutes(ctx));
  documentedRoutes(router, mount, [
    {
      method: 'get',
      path: '/entries',
      access: 'library:read',
      summary: 'List entries of every kind (the review queue uses `state=in-review`)',
      tags: ['Library'],
      query: allEntriesQuerySchema,
      responses: { 200: { description: 'One page of entries.', schema: entryPageSchema } },
      handler: async (_req, res) => {
        res.json(await listEntries(ctx, undefined, query(res)));
      },
    },
    {
      method: 'get',
      path: '/suppliers',
      access: 'library:read',
      summary: 'Suppliers to choose from',
      tags: ['Library'],
      responses: { 200: { description: 'Suppliers by name.', schema: z.array(z.object({ id: z.number(), name: z.string() })) } },
      handler: async (_req, res) => {
        res.json(await listSuppliers(ctx));
      },
    },
    {
      method: 'get',
      path: '/built-in-liquids',
      access: 'library:read',
      summary: 'Built-in liquids (water model, saline, handbook solvents) at 20 °C; read-only',
      tags: ['Liquids'],
      responses: { 200: { description: 'Built-in liquids.', schema: z.array(z.record(z.string(), z.unknown())) } },
      handler: (_req, res) => {
        res.json(builtInLiquids());
      },
    },
  ]);
  for (const kind of LIBRARY_KINDS) {
    const collection = `/${LIBRARY_COLLECTION[kind]}`;
    router.use(collection, documentedRoutes(Router(), mount + collection, kindRoutes(kind, ctx)));
  }
  return router;
}
