// The suite's own check that no request is answered 5xx unless a test asks for it (test/support/test-app.ts).
import express from 'express';
import request from 'supertest';
import { DELIBERATE_5XX_HEADER, recordingServerErrors } from '../support/test-app';

function appThatFails() {
  const app = express();
  app.get('/fine', (_req, res) => res.json({ ok: true }));
  app.get('/broken', (_req, res) => res.status(500).json({ error: { code: 'internal', message: 'It broke.' } }));
  app.get('/unavailable', (_req, res) => res.status(503).send('down for a moment'));
  return app;
}

it('notes each 5xx answer with its method, path and body, and nothing else', async () => {
  const unexpected: string[] = [];
  const app = recordingServerErrors(appThatFails(), unexpected);
  expect((await request(app).get('/fine')).status).toBe(200);
  expect((await request(app).get('/broken?x=1')).status).toBe(500);
  expect((await request(app).get('/unavailable')).status).toBe(503);
  expect(unexpected).toEqual([
    'GET /broken?x=1 answered 500: {"error":{"code":"internal","message":"It broke."}}',
    'GET /unavailable answered 503: down for a moment',
  ]);
});

it('leaves out a 5xx that the request marks as deliberate', async () => {
  const unexpected: string[] = [];
  const app = recordingServerErrors(appThatFails(), unexpected);
  expect((await request(app).get('/broken').set(DELIBERATE_5XX_HEADER, 'yes')).status).toBe(500);
  expect(unexpected).toEqual([]);
});
