import { Router, type Response } from 'express';
import type { z } from 'zod';
import type { DesignWrite, ProjectWrite, RerunRequest, VariantWrite } from 'wick-core';
import type { AppDeps } from '../app';
import type { SessionUser } from '../auth/authorize';
import { documentedRoutes } from '../openapi/documented-routes';
import {
  designWriteSchema,
  idParamsSchema,
  projectWriteSchema,
  rerunSchema,
  variantExportQuerySchema,
  variantWriteSchema,
} from '../schemas/designs';
import {
  createDesign,
  createProject,
  createVariant,
  deleteDesign,
  deleteVariant,
  designsContext,
  getDesign,
  getProject,
  getVariant,
  listProjects,
  rerunVariant,
  updateDesign,
  updateProject,
  updateVariant,
} from '../services/designs';
import { exportVariantCsv, getVariantReport } from '../services/reports';

const user = (res: Response) => res.locals['user'] as SessionUser;
const id = (res: Response) => (res.locals['params'] as z.output<typeof idParamsSchema>).id;
const body = <T>(res: Response) => res.locals['body'] as T;

/** Sends a CSV as a download. */
export function sendCsv(res: Response, file: { fileName: string; csv: string }): void {
  res.setHeader('Content-Type', 'text/csv; charset=utf-8');
  res.setHeader('Content-Disposition', `attachment; filename="${file.fileName}"`);
  res.send(file.csv);
}

/**
 * Projects → designs → variants (`/api/projects`, `/api/designs`, `/api/variants`). Reading needs
 * `designs:read`, changing `designs:edit`, exports and reports `designs:export`.
 */
export function designsRouter({ sequelize }: AppDeps): Router {
  const ctx = designsContext(sequelize);
  const tags = ['Designs'];
  return documentedRoutes(Router(), '/api', [
    {
      method: 'get',
      path: '/projects',
      access: 'designs:read',
      summary: 'List projects',
      tags,
      responses: { 200: { description: 'Projects with their counts of designs and variants.' } },
      handler: async (_req, res) => void res.json(await listProjects(ctx)),
    },
    {
      method: 'post',
      path: '/projects',
      access: 'designs:edit',
      summary: 'Create a project',
      tags,
      body: projectWriteSchema,
      responses: { 201: { description: 'The project.' }, 409: { description: 'The name is taken.' } },
      handler: async (_req, res) => void res.status(201).json(await createProject(ctx, body<ProjectWrite>(res), user(res))),
    },
    {
      method: 'get',
      path: '/projects/:id',
      access: 'designs:read',
      summary: 'A project with its designs, variant summaries and decisions',
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'The project.' }, 404: { description: 'No such project.' } },
      handler: async (_req, res) => void res.json(await getProject(ctx, id(res))),
    },
    {
      method: 'put',
      path: '/projects/:id',
      access: 'designs:edit',
      summary: 'Rename or describe a project',
      tags,
      params: idParamsSchema,
      body: projectWriteSchema,
      responses: { 200: { description: 'The project.' }, 404: { description: 'No such project.' } },
      handler: async (_req, res) => void res.json(await updateProject(ctx, id(res), body<ProjectWrite>(res), user(res))),
    },
    {
      method: 'post',
      path: '/projects/:id/designs',
      access: 'designs:edit',
      summary: 'Create a design in a project',
      tags,
      params: idParamsSchema,
      body: designWriteSchema,
      responses: { 201: { description: 'The design.' }, 404: { description: 'No such project.' }, 409: { description: 'The name is taken.' } },
      handler: async (_req, res) => void res.status(201).json(await createDesign(ctx, id(res), body<DesignWrite>(res), user(res))),
    },
    {
      method: 'get',
      path: '/designs/:id',
      access: 'designs:read',
      summary: 'A design with its variant summaries',
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'The design.' }, 404: { description: 'No such design.' } },
      handler: async (_req, res) => void res.json(await getDesign(ctx, id(res))),
    },
    {
      method: 'put',
      path: '/designs/:id',
      access: 'designs:edit',
      summary: 'Rename or describe a design',
      tags,
      params: idParamsSchema,
      body: designWriteSchema,
      responses: { 200: { description: 'The design.' }, 404: { description: 'No such design.' } },
      handler: async (_req, res) => void res.json(await updateDesign(ctx, id(res), body<DesignWrite>(res), user(res))),
    },
    {
      method: 'delete',
      path: '/designs/:id',
      access: 'designs:edit',
      summary: 'Delete a design and its variants',
      tags,
      params: idParamsSchema,
      responses: { 204: { description: 'Deleted.' }, 404: { description: 'No such design.' } },
      handler: async (_req, res) => {
        await deleteDesign(ctx, id(res), user(res));
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/designs/:id/variants',
      access: 'designs:edit',
      summary: 'Save a new variant (evaluated on the server)',
      description: 'The inputs are checked by wick-core; the results are computed here and stored with the wick-core version.',
      tags,
      params: idParamsSchema,
      body: variantWriteSchema,
      responses: { 201: { description: 'The saved variant with its results.' }, 404: { description: 'No such design.' }, 409: { description: 'The name is taken.' } },
      handler: async (_req, res) => void res.status(201).json(await createVariant(ctx, id(res), body<VariantWrite>(res), user(res))),
    },
    {
      method: 'get',
      path: '/variants/:id',
      access: 'designs:read',
      summary: 'A saved variant with its results and the state of its library materials',
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'The variant.' }, 404: { description: 'No such variant.' } },
      handler: async (_req, res) => void res.json(await getVariant(ctx, id(res))),
    },
    {
      method: 'put',
      path: '/variants/:id',
      access: 'designs:edit',
      summary: 'Save changes to a variant (optimistic locking by version)',
      tags,
      params: idParamsSchema,
      body: variantWriteSchema,
      responses: { 200: { description: 'The variant.' }, 404: { description: 'No such variant.' }, 409: { description: 'Saved by someone else since it was read, or the name is taken.' } },
      handler: async (_req, res) => void res.json(await updateVariant(ctx, id(res), body<VariantWrite>(res), user(res))),
    },
    {
      method: 'delete',
      path: '/variants/:id',
      access: 'designs:edit',
      summary: 'Delete a variant',
      tags,
      params: idParamsSchema,
      responses: { 204: { description: 'Deleted.' }, 404: { description: 'No such variant.' } },
      handler: async (_req, res) => {
        await deleteVariant(ctx, id(res), user(res));
        res.status(204).end();
      },
    },
    {
      method: 'post',
      path: '/variants/:id/rerun',
      access: 'designs:edit',
      summary: 'Recompute a variant with the running wick-core, optionally moving pins to the newest approved revisions',
      tags,
      params: idParamsSchema,
      body: rerunSchema,
      responses: { 200: { description: 'The variant.' }, 404: { description: 'No such variant.' }, 409: { description: 'Stale version.' } },
      handler: async (_req, res) => void res.json(await rerunVariant(ctx, id(res), body<RerunRequest>(res), user(res))),
    },
    {
      method: 'get',
      path: '/variants/:id/export.csv',
      access: 'designs:export',
      summary: 'A variant as CSV: inputs with sources, key figures, warnings (what=summary) or its curves (what=curve)',
      tags,
      params: idParamsSchema,
      query: variantExportQuerySchema,
      responses: { 200: { description: 'CSV file.', contentType: 'text/csv' }, 404: { description: 'No such variant.' } },
      handler: async (_req, res) => {
        const { what } = res.locals['query'] as z.output<typeof variantExportQuerySchema>;
        sendCsv(res, await exportVariantCsv(ctx, id(res), what, user(res)));
      },
    },
    {
      method: 'get',
      path: '/variants/:id/report',
      access: 'designs:export',
      summary: 'Everything the printable report of a variant shows',
      tags,
      params: idParamsSchema,
      responses: { 200: { description: 'Report data.' }, 404: { description: 'No such variant.' } },
      handler: async (_req, res) => void res.json(await getVariantReport(ctx, id(res), user(res))),
    },
  ]);
}
