// One browser's worth of state for the benches that talk HTTP to the app: its cookies (session and XSRF-TOKEN) and
// the token it echoes on writes, over loopback.
import http from 'node:http';

export class BenchClient {
  private cookies = new Map<string, string>();
  constructor(
    private readonly port: number,
    private readonly agent: http.Agent,
    /** Stands for the client's own address: the app trusts X-Forwarded-For from loopback. */
    private readonly clientAddress?: string,
  ) {}

  request(method: 'GET' | 'POST' | 'PATCH' | 'DELETE', url: string, body?: unknown): Promise<{ status: number; text: string }> {
    const payload = body === undefined ? undefined : JSON.stringify(body);
    const headers: Record<string, string> = { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') };
    if (this.clientAddress) headers['x-forwarded-for'] = this.clientAddress;
    if (payload !== undefined) headers['content-type'] = 'application/json';
    if (method !== 'GET') headers['x-xsrf-token'] = decodeURIComponent(this.cookies.get('XSRF-TOKEN') ?? '');
    return new Promise((resolve, reject) => {
      const req = http.request({ host: '127.0.0.1', port: this.port, path: url, method, headers, agent: this.agent }, (res) => {
        for (const cookie of res.headers['set-cookie'] ?? []) {
          const [pair] = cookie.split(';');
          const at = pair.indexOf('=');
          this.cookies.set(pair.slice(0, at), pair.slice(at + 1));
        }
        const chunks: Buffer[] = [];
        res.on('data', (chunk: Buffer) => chunks.push(chunk));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8') }));
        res.on('error', reject);
      });
      req.on('error', reject);
      req.end(payload);
    });
  }
}
