// The built client is served from any folder, including one under a dot folder (~/.local/src/tallyhood).
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { startTestApp, type TestApp } from '../support/test-app';

let t: TestApp;
let clientDist: string;

beforeAll(async () => {
  const base = fs.mkdtempSync(path.join(os.tmpdir(), 'tallyhood-client-'));
  clientDist = path.join(base, '.local', 'src', 'tallyhood', 'browser');
  fs.mkdirSync(clientDist, { recursive: true });
  fs.writeFileSync(path.join(clientDist, 'index.html'), '<!doctype html><title>client index marker</title>');
  fs.writeFileSync(path.join(clientDist, 'main-abc.js'), 'console.log("client bundle marker");');
  t = await startTestApp({ clientDist });
});

afterAll(async () => {
  await t.close();
  fs.rmSync(path.dirname(path.dirname(path.dirname(clientDist))), { recursive: true, force: true });
});

test('a client folder under a dot folder serves its index for app routes and its files as they are', async () => {
  const home = await request(t.app).get('/');
  expect(home.status).toBe(200);
  expect(home.text).toContain('client index marker');

  const deepLink = await request(t.app).get('/builds/12/receipts');
  expect(deepLink.status).toBe(200);
  expect(deepLink.text).toContain('client index marker');

  const bundle = await request(t.app).get('/main-abc.js');
  expect(bundle.status).toBe(200);
  expect(bundle.text).toContain('client bundle marker');
});

test('dot files inside the client folder itself stay hidden', async () => {
  fs.writeFileSync(path.join(clientDist, '.env'), 'SECRET=1');
  const hidden = await request(t.app).get('/.env');
  // The catch-all answers the index, never the dot file.
  expect(hidden.text).not.toContain('SECRET');
});

test('an unknown API route still answers the API error shape, not the index', async () => {
  const response = await request(t.app).get('/api/nothing-here');
  expect(response.status).toBe(404);
  expect(response.body.error.code).toBe('not_found');
});
