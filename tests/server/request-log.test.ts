import express from 'express';
import pino from 'pino';
import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { requestLog } from '../../server/src/lib/request-log';

/** An app with the request log in front, writing its lines to an array at the given level. */
function appAt(level: pino.Level) {
  const lines: Record<string, unknown>[] = [];
  const logger = pino({ level }, { write: (s: string) => void lines.push(JSON.parse(s) as Record<string, unknown>) });
  const app = express();
  app.use(requestLog(logger));
  app.get('/ok', (req, res) => {
    res.json({ id: req.id });
  });
  app.get('/missing', (req, res) => {
    req.log.info({ why: 'no such thing' }, 'looked for it');
    res.status(404).json({});
  });
  app.get('/api/health', (_req, res) => {
    res.status(503).json({});
  });
  return { app, lines };
}

describe('request log', () => {
  it('gives every answer a request id, and req.log lines carry it', async () => {
    const { app, lines } = appAt('info');
    const ok = await request(app).get('/ok');
    expect(ok.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    expect(ok.body.id).toBe(ok.headers['x-request-id']);
    const missing = await request(app).get('/missing?q=secret');
    const id = missing.headers['x-request-id'];
    expect(lines.filter((l) => l.reqId === id).map((l) => l.msg)).toEqual(['looked for it', 'request completed']);
    const done = lines.find((l) => l.reqId === id && l.msg === 'request completed');
    expect(done).toMatchObject({ level: 30, req: { method: 'GET', url: '/missing' }, res: { statusCode: 404 } });
  });

  it('writes nothing for a 2xx at the production level, and a line at debug', async () => {
    const prod = appAt('info');
    await request(prod.app).get('/ok');
    expect(prod.lines).toEqual([]);
    const debug = appAt('debug');
    await request(debug.app).get('/ok');
    expect(debug.lines).toHaveLength(1);
    expect(debug.lines[0]).toMatchObject({ level: 20, res: { statusCode: 200 } });
  });

  it('leaves health checks out', async () => {
    const { app, lines } = appAt('debug');
    await request(app).get('/api/health');
    expect(lines).toEqual([]);
  });
});
