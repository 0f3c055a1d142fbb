// A cookie-keeping API client for tests that follows the CSRF convention the browser client follows.
import request from 'supertest';
import type { Express } from 'express';
import { randomUUID } from 'node:crypto';
import { caughtMailOf, signUpToken } from './caught-mail';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

export class ApiClient {
  private readonly agent: ReturnType<typeof request.agent>;
  private csrf = '';

  /** `clientAddress` stands in for the caller's IP address (the app trusts X-Forwarded-For from loopback). */
  constructor(app: Express, options: { clientAddress?: string } = {}) {
    this.agent = request.agent(app);
    if (options.clientAddress) this.agent.set('X-Forwarded-For', options.clientAddress);
  }

  /** Fetches the XSRF-TOKEN cookie the way the client does at start. */
  async init(): Promise<this> {
    const res = await this.agent.get('/api/auth/me');
    this.readToken(res.headers['set-cookie']);
    return this;
  }

  private readToken(setCookie: string | string[] | undefined) {
    for (const cookie of ([] as string[]).concat(setCookie ?? [])) {
      const match = /^XSRF-TOKEN=([^;]+)/.exec(cookie);
      if (match) this.csrf = decodeURIComponent(match[1]);
    }
  }

  async send(method: Method, url: string, body?: unknown) {
    let req = this.agent[method](url);
    if (method !== 'get') req = req.set('X-XSRF-TOKEN', this.csrf);
    const res = await (body === undefined ? req : req.send(body as object));
    this.readToken(res.headers['set-cookie']);
    return res;
  }

  /** Sends a raw text body (CSV) with a content type. */
  async sendText(method: 'post' | 'put', url: string, text: string, contentType = 'text/csv') {
    const res = await this.agent[method](url).set('X-XSRF-TOKEN', this.csrf).set('Content-Type', contentType).send(text);
    this.readToken(res.headers['set-cookie']);
    return res;
  }

  get(url: string) {
    return this.send('get', url);
  }
  post(url: string, body?: unknown) {
    return this.send('post', url, body ?? {});
  }
  patch(url: string, body?: unknown) {
    return this.send('patch', url, body ?? {});
  }
  delete(url: string) {
    return this.send('delete', url);
  }
}

export const TEST_PASSWORD = 'correct-horse-battery';

export function uniqueEmail(label: string): string {
  return `${label}-${randomUUID().slice(0, 8)}@example.test`;
}

/** A new account, signed in, made as a person makes one: sign up, then open the link the mail brings. */
export async function signedUpClient(app: Express, label: string): Promise<{ client: ApiClient; email: string; userId: string }> {
  const client = await new ApiClient(app).init();
  const email = uniqueEmail(label);
  const res = await client.post('/api/auth/sign-up', { email, displayName: `Test ${label}`, password: TEST_PASSWORD });
  if (res.status !== 202) throw new Error(`sign-up failed: ${res.status} ${JSON.stringify(res.body)}`);
  const token = await signUpToken(caughtMailOf(app), email);
  const confirmed = await client.post('/api/auth/sign-up/confirm', { token });
  if (confirmed.status !== 201) throw new Error(`sign-up confirm failed: ${confirmed.status} ${JSON.stringify(confirmed.body)}`);
  return { client, email, userId: confirmed.body.user.id };
}

export const NEW_BUILD = { name: 'Test coupé', vehicle: '1981 test car', currency: 'USD' };
