import { Router } from 'express';
import { listModels, runModel, type BatchComputeRequest, type ComputeRequest } from 'wick-core';
import type { AppDeps } from '../app';
import { computePool } from '../compute/compute-pool';
import { documentedRoutes } from '../openapi/documented-routes';
import { batchComputeRequestSchema, computeRequestSchema } from '../schemas/designs';

/**
 * `/api/compute`: the model registry over HTTP, with the same request and response types as the CLI
 * (`wick run`). A model's refusal of its inputs is an `ok: false` response, not an HTTP error.
 */
export function computeRouter(_deps: AppDeps): Router {
  const tags = ['Compute'];
  return documentedRoutes(Router(), '/api/compute', [
    {
      method: 'get',
      path: '/models',
      access: 'compute:run',
      summary: 'Every model with its parameters and units (as `wick list`)',
      tags,
      responses: { 200: { description: 'Model descriptions.' } },
      handler: (_req, res) => void res.json(listModels()),
    },
    {
      method: 'post',
      path: '/',
      access: 'compute:run',
      summary: 'Run one model (as `wick run`)',
      tags,
      body: computeRequestSchema,
      responses: { 200: { description: 'ComputeResponse: `ok: true` with the result, or `ok: false` with the reason.' } },
      handler: (_req, res) => void res.json(runModel(res.locals['body'] as ComputeRequest)),
    },
    {
      method: 'post',
      path: '/batch',
      access: 'compute:run',
      summary: 'Run many model requests in one call (e.g. 100 design variants)',
      tags,
      body: batchComputeRequestSchema,
      description: 'The requests are shared out over the server’s compute threads; the answers come back in request order.',
      responses: { 200: { description: 'BatchComputeResponse: one ComputeResponse per request, in order.' } },
      handler: async (_req, res) => void res.json(await computePool().runBatch(res.locals['body'] as BatchComputeRequest)),
    },
  ]);
}
