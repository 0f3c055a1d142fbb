// Test set-up for receipts: one uploaded for real, marked as read (the reading is tested on its own), given its
// header and lines through the API, and filed.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Agent } from 'supertest';
import { Receipt } from '../../backend/src/receipts/receipt.entity';
import type { ApiClient } from './api-client';
import type { TestApp } from './test-app';

const SLIP = readFileSync(path.resolve(__dirname, '../fixtures/receipts/generated/counter-1.png'));

export function uploadSlip(client: ApiClient, buildId: string) {
  const raw = client as unknown as { agent: Agent; csrf: string };
  return raw.agent.post(`/api/builds/${buildId}/receipts`).set('X-XSRF-TOKEN', raw.csrf).attach('files', SLIP, 'slip.png');
}

export async function filedReceipt(t: TestApp, client: ApiClient, buildId: string, header: object, lines: object[], options: { file?: boolean } = {}) {
  const id = (await uploadSlip(client, buildId)).body.receipts[0].id as string;
  await t.orm.em.fork().nativeUpdate(Receipt, { id }, { state: 'to_check' });
  const base = `/api/builds/${buildId}/receipts/${id}`;
  await client.patch(base, { subtotal: null, tax: null, shipping: null, discount: null, ...header, version: (await client.get(base)).body.version });
  for (const line of lines) {
    const res = await client.post(`${base}/lines`, line);
    if (res.status !== 201) throw new Error(`line refused: ${JSON.stringify(res.body)}`);
  }
  if (options.file === false) return (await client.get(base)).body;
  const filed = await client.post(`${base}/file`, { version: (await client.get(base)).body.version });
  if (filed.status !== 200) throw new Error(`filing refused: ${JSON.stringify(filed.body)}`);
  return filed.body;
}
