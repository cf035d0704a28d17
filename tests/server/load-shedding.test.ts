// The in-flight cap: past it a request is answered at once with 503, Retry-After
// and a JSON error; the health probe is always admitted; a finished or abandoned
// request frees its place.
import { afterEach, describe, expect, it } from 'vitest';
import express from 'express';
import http from 'node:http';
import request from 'supertest';
import { createLoadShedding } from '../../server/middlewares/load-shedding';

let server: http.Server | undefined;
afterEach(() => new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve())));

function appWithCap(maxInFlight: number) {
  const shedding = createLoadShedding({ maxInFlight });
  const releases: (() => void)[] = [];
  const app = express();
  app.use(shedding);
  app.get('/api/health', (_req, res) => res.json({ ok: true }));
  app.get('/api/slow', async (_req, res) => {
    await new Promise<void>((resolve) => releases.push(resolve));
    res.json({ done: true });
  });
  app.get('/api/fast', (_req, res) => res.json({ fast: true }));
  server = http.createServer(app).listen(0, '127.0.0.1');
  return { server, shedding, releaseAll: () => releases.splice(0).forEach((release) => release()) };
}

const waitUntil = async (check: () => boolean) => {
  for (let i = 0; i < 200 && !check(); i += 1) await new Promise((resolve) => setTimeout(resolve, 10));
};

describe('load shedding', () => {
  it('when the cap is reached, then the next request gets 503 with Retry-After and a JSON error, and health still answers', async () => {
    const { server, shedding, releaseAll } = appWithCap(2);
    const slow = [request(server).get('/api/slow').then((r) => r), request(server).get('/api/slow').then((r) => r)];
    await waitUntil(() => shedding.inFlight() === 2);
    const started = performance.now();
    const refused = await request(server).get('/api/fast');
    expect(performance.now() - started).toBeLessThan(500);
    expect(refused.status).toBe(503);
    expect(refused.headers['retry-after']).toBe('1');
    expect(refused.body).toEqual({ error: { code: 'overloaded', message: expect.any(String) } });
    expect((await request(server).get('/api/health')).status).toBe(200);
    releaseAll();
    expect((await Promise.all(slow)).map((r) => r.status)).toEqual([200, 200]);
    await waitUntil(() => shedding.inFlight() === 0);
    expect(shedding.inFlight()).toBe(0);
    expect((await request(server).get('/api/fast')).status).toBe(200);
  });

  it('when a client abandons its request, then its place is freed', async () => {
    const { server, shedding, releaseAll } = appWithCap(1);
    await new Promise<void>((resolve) => (server.listening ? resolve() : server.once('listening', () => resolve())));
    const { port } = server.address() as { port: number };
    const abandoned = http.get({ host: '127.0.0.1', port, path: '/api/slow' });
    abandoned.on('error', () => undefined);
    await waitUntil(() => shedding.inFlight() === 1);
    abandoned.destroy();
    await waitUntil(() => shedding.inFlight() === 0);
    expect(shedding.inFlight()).toBe(0);
    releaseAll();
  });
});
