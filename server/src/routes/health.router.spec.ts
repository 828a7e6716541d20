import request from 'supertest';
import { createApp } from '../app';
import { loadConfig } from '../config';
import { createSequelize } from '../db';
import { testApp } from '../../test/test-app';

describe('GET /api/health', () => {
  it('when the database answers, then 200 with status ok, db up and the package version', async () => {
    const res = await request(testApp()).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', db: 'up', version: loadConfig().version });
  });

  it('when the database is unreachable, then 503 with db down', async () => {
    // A port nothing listens on: the pool fails fast.
    const broken = createSequelize('postgres://nobody:x@127.0.0.1:9/none');
    const app = createApp({ config: { ...loadConfig(), env: 'test', logRequests: false, uiDir: null }, sequelize: broken });
    const res = await request(app).get('/api/health').expect(503);
    expect(res.body.db).toBe('down');
    expect(res.body.status).toBe('degraded');
    await broken.close();
  });
});

describe('error responses', () => {
  it('when an API route does not exist, then a JSON 404 in the error envelope', async () => {
    const res = await request(testApp()).get('/api/no-such-thing').expect(404);
    expect(res.body.error.code).toBe('not-found');
    expect(res.body.error.message).toContain('/api/no-such-thing');
  });

  it('when the JSON body is malformed, then 400 in the error envelope and no stack trace', async () => {
    const res = await request(testApp()).post('/api/health').set('Content-Type', 'application/json').send('{"a":').expect(400);
    expect(res.body.error).toBeDefined();
    expect(JSON.stringify(res.body)).not.toContain('at ');
  });
});
