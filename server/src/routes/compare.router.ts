import { Router, type Response } from 'express';
import type { z } from 'zod';
import type { DecisionWrite } from 'wick-core';
import type { AppDeps } from '../app';
import type { SessionUser } from '../auth/authorize';
import { documentedRoutes } from '../openapi/documented-routes';
import { compareQuerySchema, decisionWriteSchema } from '../schemas/designs';
import { compareVariants, recordDecision } from '../services/compare';
import { designsContext } from '../services/designs';
import { exportComparisonCsv, getComparisonReport } from '../services/reports';
import { sendCsv } from './designs.router';

const user = (res: Response) => res.locals['user'] as SessionUser;
const selection = (res: Response) => res.locals['query'] as z.output<typeof compareQuerySchema>;

/** Compare 2–8 variants (`/api/compare`), export the comparison, and record decisions (`/api/decisions`). */
export function compareRouter({ sequelize }: AppDeps): Router {
  const ctx = designsContext(sequelize);
  const tags = ['Compare & decide'];
  return documentedRoutes(Router(), '/api', [
    {
      method: 'get',
      path: '/compare',
      access: 'designs:read',
      summary: 'Key figures of 2–8 variants with deltas against a baseline, the best marked, and curves to overlay',
      tags,
      query: compareQuerySchema,
      responses: { 200: { description: 'The comparison.' }, 404: { description: 'A variant does not exist.' } },
      handler: async (_req, res) => {
        const q = selection(res);
        res.json(await compareVariants(ctx, q.variants, q.baseline));
      },
    },
    {
      method: 'get',
      path: '/compare/export.csv',
      access: 'designs:export',
      summary: 'The comparison as CSV',
      tags,
      query: compareQuerySchema,
      responses: { 200: { description: 'CSV file.', contentType: 'text/csv' }, 404: { description: 'A variant does not exist.' } },
      handler: async (_req, res) => {
        const q = selection(res);
        sendCsv(res, await exportComparisonCsv(ctx, q.variants, q.baseline, user(res)));
      },
    },
    {
      method: 'get',
      path: '/compare/report',
      access: 'designs:export',
      summary: 'Everything the printable comparison report shows',
      tags,
      query: compareQuerySchema,
      responses: { 200: { description: 'Report data.' }, 404: { description: 'A variant does not exist.' } },
      handler: async (_req, res) => {
        const q = selection(res);
        res.json(await getComparisonReport(ctx, q.variants, q.baseline, user(res)));
      },
    },
    {
      method: 'post',
      path: '/decisions',
      access: 'decisions:record',
      summary: 'Record the decision taken on a comparison (written to the audit log)',
      tags,
      body: decisionWriteSchema,
      responses: { 201: { description: 'The decision.' }, 404: { description: 'A variant does not exist.' } },
      handler: async (_req, res) => void res.status(201).json(await recordDecision(ctx, res.locals['body'] as DecisionWrite, user(res))),
    },
  ]);
}
