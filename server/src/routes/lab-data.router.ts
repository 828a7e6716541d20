import { type RequestHandler, type Response, Router } from 'express';
import multer from 'multer';
import type { z } from 'zod';
import type { AppDeps } from '../app';
import type { SessionUser } from '../auth/authorize';
import { AppError } from '../errors';
import { loadMailConfig } from '../mail/mail-config';
import { mailOutbox } from '../mail/outbox';
import { documentedRoutes } from '../openapi/documented-routes';
import {
  comparisonParamsSchema,
  comparisonQuerySchema,
  contactAngleQuerySchema,
  labIdParamsSchema,
  proposeSchema,
  runCreateSchema,
  runListQuerySchema,
  runUpdateSchema,
  runUploadFieldsSchema,
  setListQuerySchema,
  setUpdateSchema,
  versionQuerySchema,
} from '../schemas/lab-data';
import {
  comparePrediction,
  contactAngle,
  createRun,
  deleteRun,
  getRun,
  getSet,
  labContext,
  listRuns,
  listSets,
  predictionCandidates,
  proposeToLibrary,
  runFile,
  updateRun,
  updateSet,
} from '../services/lab-data';
import { libraryContext } from '../services/library';
import { UPLOAD_LIMITS } from '../services/library-uploads';
import { parseOr422 } from './validate';

const user = (res: Response) => res.locals['user'] as SessionUser;
const local = <T>(res: Response, key: 'params' | 'query' | 'body') => res.locals[key] as T;
type Id = z.output<typeof labIdParamsSchema>;

/**
 * The CSV in the multipart field `file` (kept in memory, bounded by the library's upload limit) and the run's
 * metadata as JSON in the field `meta`. Multer's refusals become the usual error envelope; nothing is stored.
 */
function receiveRun(): RequestHandler {
  const single = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: UPLOAD_LIMITS.maxBytes, files: 1, fields: 4, fieldSize: 20_000 },
  }).single('file');
  return (req, res, next) => {
    single(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        const tooLarge = err.code === 'LIMIT_FILE_SIZE';
        const message = tooLarge ? `The file is larger than ${Math.round(UPLOAD_LIMITS.maxBytes / 1024)} KiB, the most accepted.` : `The upload could not be read: ${err.message}.`;
        return next(new AppError(tooLarge ? 413 : 422, tooLarge ? 'file-too-large' : 'upload-invalid', `${message} Nothing was stored.`, { issues: [{ line: null, message }] }));
      }
      if (err) return next(err);
      if (!req.file) return next(new AppError(422, 'upload-invalid', 'Attach the CSV file in the form field "file".', { issues: [{ line: null, message: 'No file was sent.' }] }));
      let meta: unknown;
      try {
        meta = JSON.parse(String((req.body as Record<string, unknown> | undefined)?.['meta'] ?? ''));
      } catch {
        return next(new AppError(422, 'validation-failed', 'Invalid form fields: meta — give the run details as JSON.', { issues: [{ field: 'meta', rule: 'json', message: 'Not JSON.' }] }));
      }
      try {
        res.locals['body'] = parseOr422(runCreateSchema, meta);
      } catch (e) {
        return next(e);
      }
      next();
    });
  };
}

/**
 * `/api/lab-data/…`: measured wicking runs, replicate sets, fits, the reference-liquid contact angle, prediction
 * versus measurement and proposals to the library. Reading needs `labdata:read`, changing `labdata:edit`;
 * comparisons with design variants also need `designs:read`.
 */
export function labDataRouter(deps: AppDeps): Router {
  const mail = loadMailConfig(deps.config.publicUrl);
  const library = libraryContext(deps.sequelize, mailOutbox(deps.sequelize, mail, { flushOnStart: deps.config.env !== 'test' }));
  const ctx = labContext(deps.sequelize, library, deps.config.publicUrl);
  const tags = ['Lab data'];
  const conflict = { 409: { description: 'Stale version (`version-conflict`, with the current record) or a rule of the state.' } };
  return documentedRoutes(Router(), '/api/lab-data', [
    {
      method: 'get',
      path: '/runs',
      access: 'labdata:read',
      summary: 'List lab runs (newest first), optionally of one set or one web',
      tags,
      query: runListQuerySchema,
      responses: { 200: { description: 'Run summaries with their key fitted figures.' } },
      handler: async (_req, res) => void res.json(await listRuns(ctx, local(res, 'query'))),
    },
    {
      method: 'post',
      path: '/runs',
      access: 'labdata:edit',
      summary: 'Upload a measured wicking run (CSV + details); saved only when the curve can be fitted',
      description:
        'Multipart: `file` — CSV with time and height or mass, each with its unit in the header ("time (s),height (mm)"); ' +
        '`meta` — the run details as JSON (LabRunCreate). Too few readings, times that do not increase, negative values, a flat ' +
        'curve or a file that cannot be read are refused with 422 and every problem with its line; nothing is stored.',
      tags,
      before: [receiveRun()],
      multipart: runUploadFieldsSchema,
      responses: {
        201: { description: 'The run with its fits.' },
        413: { description: 'File larger than the limit; nothing stored.' },
        415: { description: 'Not a text file; nothing stored.' },
      },
      handler: async (req, res) => {
        const f = req.file!;
        const file = { fileName: Buffer.from(f.originalname, 'latin1').toString('utf8'), mediaType: f.mimetype, bytes: f.buffer };
        res.status(201).json(await createRun(ctx, local(res, 'body'), file, user(res)));
      },
    },
    {
      method: 'get',
      path: '/runs/:id',
      access: 'labdata:read',
      summary: 'A run with its curve, details and both fits (Washburn slope, gravity-restrained)',
      tags,
      params: labIdParamsSchema,
      responses: { 200: { description: 'The run.' }, 404: { description: 'No such run.' } },
      handler: async (_req, res) => void res.json(await getRun(ctx, local<Id>(res, 'params').id, user(res))),
    },
    {
      method: 'put',
      path: '/runs/:id',
      access: 'labdata:edit',
      summary: 'Change a run’s name, conditions, notes and fit settings (window, intercept, contact angle)',
      tags,
      params: labIdParamsSchema,
      body: runUpdateSchema,
      responses: { 200: { description: 'The run, refitted.' }, ...conflict },
      handler: async (_req, res) => void res.json(await updateRun(ctx, local<Id>(res, 'params').id, local(res, 'body'), user(res))),
    },
    {
      method: 'delete',
      path: '/runs/:id',
      access: 'labdata:edit',
      summary: 'Delete a run (not one that backs a proposal); an emptied set goes too',
      tags,
      params: labIdParamsSchema,
      query: versionQuerySchema,
      responses: { 204: { description: 'Deleted.' }, ...conflict },
      handler: async (_req, res) => {
        await deleteRun(ctx, local<Id>(res, 'params').id, local<z.output<typeof versionQuerySchema>>(res, 'query').version, user(res));
        res.status(204).end();
      },
    },
    {
      method: 'get',
      path: '/runs/:id/file',
      access: 'labdata:read',
      summary: 'The uploaded CSV of a run, byte for byte',
      tags,
      params: labIdParamsSchema,
      responses: { 200: { description: 'The file.', contentType: 'text/csv' } },
      handler: async (_req, res) => {
        const f = await runFile(ctx, local<Id>(res, 'params').id);
        res.setHeader('Content-Type', f.mediaType.startsWith('text/') ? f.mediaType : 'application/octet-stream');
        res.setHeader('Content-Disposition', `attachment; filename*=UTF-8''${encodeURIComponent(f.fileName)}`);
        res.setHeader('X-Content-SHA256', f.sha256);
        res.send(f.content);
      },
    },
    {
      method: 'get',
      path: '/runs/:id/predictions',
      access: 'labdata:read',
      summary: 'Saved design variants that use the run’s web and liquid (needs designs:read too)',
      tags,
      params: labIdParamsSchema,
      responses: { 200: { description: 'Candidates, with configuration and web revision matches flagged.' } },
      handler: async (_req, res) => void res.json(await predictionCandidates(ctx, local<Id>(res, 'params').id, user(res))),
    },
    {
      method: 'get',
      path: '/runs/:id/predictions/:variantId',
      access: 'labdata:read',
      summary: 'Prediction versus measurement: RMSE, bias, largest deviation, time-to-height errors',
      tags,
      params: comparisonParamsSchema,
      query: comparisonQuerySchema,
      responses: { 200: { description: 'Both curves and the error metrics.' }, 404: { description: 'The variant does not use this web and liquid.' } },
      handler: async (_req, res) => {
        const p = local<z.output<typeof comparisonParamsSchema>>(res, 'params');
        res.json(await comparePrediction(ctx, p.id, p.variantId, local<z.output<typeof comparisonQuerySchema>>(res, 'query').heights, user(res)));
      },
    },
    {
      method: 'get',
      path: '/sets',
      access: 'labdata:read',
      summary: 'List replicate sets',
      tags,
      query: setListQuerySchema,
      responses: { 200: { description: 'Sets with run counts and proposals.' } },
      handler: async (_req, res) => void res.json(await listSets(ctx, local(res, 'query'))),
    },
    {
      method: 'get',
      path: '/sets/:id',
      access: 'labdata:read',
      summary: 'A set: its runs, and mean, spread and outlier runs of each fitted figure',
      tags,
      params: labIdParamsSchema,
      responses: { 200: { description: 'The set.' } },
      handler: async (_req, res) => void res.json(await getSet(ctx, local<Id>(res, 'params').id, user(res))),
    },
    {
      method: 'put',
      path: '/sets/:id',
      access: 'labdata:edit',
      summary: 'Rename a set or change its notes',
      tags,
      params: labIdParamsSchema,
      body: setUpdateSchema,
      responses: { 200: { description: 'The set.' }, ...conflict },
      handler: async (_req, res) => void res.json(await updateSet(ctx, local<Id>(res, 'params').id, local(res, 'body'), user(res))),
    },
    {
      method: 'post',
      path: '/sets/:id/propose',
      access: 'labdata:edit',
      summary: 'Propose the set’s fitted values to the library: a new web revision, submitted for review',
      description:
        'Writes the in-plane permeability (mean of non-outlier runs) and the runs’ curves with their files into a new revision of the web, ' +
        'with a note naming the runs and linking the set; submits it for review unless `submit` is false. The web’s newest revision must be approved.',
      tags,
      params: labIdParamsSchema,
      body: proposeSchema,
      responses: { 200: { description: 'The set with its proposals.' }, ...conflict },
      handler: async (_req, res) => void res.json(await proposeToLibrary(ctx, local<Id>(res, 'params').id, local(res, 'body'), user(res))),
    },
    {
      method: 'get',
      path: '/contact-angle',
      access: 'labdata:read',
      summary: 'Contact angle by the reference-liquid (Washburn) method from two sets of the same web',
      tags,
      query: contactAngleQuerySchema,
      responses: { 200: { description: 'Material constant, cos θ and θ with their spread, and the caution about reference solvents.' } },
      handler: async (_req, res) => {
        const q = local<z.output<typeof contactAngleQuerySchema>>(res, 'query');
        res.json(await contactAngle(ctx, q.reference, q.test));
      },
    },
  ]);
}
