// A seeded random walk of the changes that move the ledger's sums, sent as the owner through the HTTP API: filing,
// reopening, refund lines for bought parts, parts sent back and kept, core deposits handed in, refunded or lost, lines
// removed. The API test and the bench both run it, then compare the running totals with a fresh aggregate.
import { CORE_STATES } from '../../shared/enums';
import { seeded } from './seeded-random';

/** One request as the owner: a supertest ApiClient or the bench's HTTP client behind the same shape. */
export type Send = (method: 'get' | 'post' | 'patch' | 'delete', url: string, body?: unknown) => Promise<{ status: number; body: any }>;

export const WALK_ACTIONS = ['reopen', 'file', 'refund line', 'part status', 'core state', 'remove line'] as const;
export type WalkAction = (typeof WALK_ACTIONS)[number];

export interface WalkResult {
  steps: number;
  /** Steps the app carried out (2xx), by action; a step with nothing to act on counts in neither. */
  applied: Record<WalkAction, number>;
  /** Steps the app refused (4xx: a stale version, a part already fitted), by action and status. */
  refused: Record<string, number>;
}

interface LineDto {
  id: string;
  kind: string;
  amount: string;
  partId: string | null;
  systemId: string | null;
}

export async function walkLedger(send: Send, buildId: string, options: { steps: number; seed: number }): Promise<WalkResult> {
  const random = seeded(options.seed);
  const pick = <T>(items: readonly T[]): T | undefined => (items.length ? items[Math.floor(random() * items.length)] : undefined);
  const base = `/api/builds/${buildId}`;
  const get = async (url: string) => {
    const res = await send('get', `${base}${url}`);
    if (res.status !== 200) throw new Error(`GET ${url} answered ${res.status}`);
    return res.body;
  };
  const receiptsIn = async (state: string) => (await get(`/receipts?state=${state}`)).receipts as { id: string }[];
  const receipt = async (id: string) => (await get(`/receipts/${id}`)) as { id: string; version: number; lines: LineDto[] };

  const result: WalkResult = { steps: options.steps, applied: Object.fromEntries(WALK_ACTIONS.map((a) => [a, 0])) as Record<WalkAction, number>, refused: {} };
  for (let step = 0; step < options.steps; step += 1) {
    const action = pick(WALK_ACTIONS)!;
    let answer: { status: number } | undefined;
    if (action === 'reopen') {
      const filed = pick(await receiptsIn('filed'));
      if (filed) answer = await send('post', `${base}/receipts/${filed.id}/reopen`);
    } else if (action === 'file') {
      const open = pick(await receiptsIn('to_check'));
      if (open) {
        const { version } = await receipt(open.id);
        // The owner accepts a total the walk's changes no longer meet; filing still allocates and derives as ever.
        answer = await send('post', `${base}/receipts/${open.id}/file`, { version, acceptDifference: { reason: 'Random walk of the ledger' } });
      }
    } else if (action === 'refund line') {
      const open = pick(await receiptsIn('to_check'));
      const filed = pick(await receiptsIn('filed'));
      const bought = filed ? pick((await receipt(filed.id)).lines.filter((line) => line.kind === 'part' && line.partId && !line.amount.startsWith('-'))) : undefined;
      if (open && bought) {
        answer = await send('post', `${base}/receipts/${open.id}/lines`, {
          kind: 'return',
          description: 'Sent back for a refund',
          amount: `-${bought.amount}`,
          partId: bought.partId,
          systemId: bought.systemId,
          returnOfLineId: bought.id,
        });
      }
    } else if (action === 'part status') {
      const part = pick((await get('/parts')).parts as { id: string; version: number }[]);
      if (part) answer = await send('patch', `${base}/parts/${part.id}`, { status: pick(['returned', 'on_hand', 'installed'] as const), version: part.version });
    } else if (action === 'core state') {
      const core = pick((await get('/cores')).cores as { id: string; version: number }[]);
      if (core) answer = await send('patch', `${base}/cores/${core.id}`, { state: pick(CORE_STATES), version: core.version });
    } else {
      const open = pick(await receiptsIn('to_check'));
      const lines = open ? (await receipt(open.id)).lines : [];
      const line = lines.length > 1 ? pick(lines) : undefined;
      if (open && line) answer = await send('delete', `${base}/receipts/${open.id}/lines/${line.id}`);
    }
    if (answer && answer.status >= 500) throw new Error(`step ${step} (${action}) answered ${answer.status}`);
    if (answer && answer.status < 300) result.applied[action] += 1;
    else if (answer) result.refused[`${action} ${answer.status}`] = (result.refused[`${action} ${answer.status}`] ?? 0) + 1;
  }
  return result;
}
