// Every environment variable the server reads, parsed and defaulted in one place.
import path from 'node:path';

export interface AppConfig {
  port: number;
  appUrl: string;
  production: boolean;
  db: { host: string; port: number; user: string; password: string; dbName: string };
  sessionSecret: string;
  secureCookies: boolean;
  smtp: { host: string; port: number; from: string };
  clientDist: string;
  storage: { endpoint: string; region: string; bucket: string; accessKeyId: string; secretAccessKey: string; forcePathStyle: boolean };
  /** Mailed receipts: builds' addresses are `<token>@domain`; the webhook route answers only with a secret set. */
  inbox: { domain: string; webhookSecret: string | null };
}

function integer(value: string | undefined, fallback: number, name: string): number {
  if (value === undefined || value === '') return fallback;
  if (!/^\d+$/.test(value)) throw new Error(`${name} must be a whole number, got "${value}".`);
  return Number(value);
}

const MIN_WEBHOOK_SECRET_LENGTH = 32;

/** A mail domain of letters, digits, dots and dashes (the receipts' addresses are made from it). */
function mailDomain(value: string | undefined): string {
  const domain = (value ?? 'receipts.localhost').trim().toLowerCase();
  if (!/^[a-z0-9]([a-z0-9-]*[a-z0-9])?(\.[a-z0-9]([a-z0-9-]*[a-z0-9])?)+$/.test(domain)) {
    throw new Error(`RECEIPTS_DOMAIN must be a mail domain such as receipts.example.com, got "${value}".`);
  }
  return domain;
}

function webhookSecret(value: string | undefined): string | null {
  if (value === undefined || value === '') return null;
  if (value.length < MIN_WEBHOOK_SECRET_LENGTH) {
    throw new Error(`INBOUND_MAIL_SECRET must be at least ${MIN_WEBHOOK_SECRET_LENGTH} characters (for example \`openssl rand -hex 32\`), or unset to turn the inbound-mail webhook off.`);
  }
  return value;
}

const DEVELOPMENT_SESSION_SECRET = 'tallyhood-development-session-secret';
const MIN_SESSION_SECRET_LENGTH = 32;

/** A deployment (NODE_ENV=production) must not start with the development defaults that make sessions forgeable or sniffable. */
function checkDeploymentDefaults(env: NodeJS.ProcessEnv): void {
  const secret = env.SESSION_SECRET ?? '';
  if (!secret || secret === DEVELOPMENT_SESSION_SECRET) {
    throw new Error('SESSION_SECRET must be set to a secret of your own when NODE_ENV=production: the built-in one is public, and anyone could forge a session with it.');
  }
  if (secret.length < MIN_SESSION_SECRET_LENGTH) {
    throw new Error(`SESSION_SECRET must be at least ${MIN_SESSION_SECRET_LENGTH} characters when NODE_ENV=production (for example \`openssl rand -base64 48\`).`);
  }
  if (env.COOKIE_SECURE !== 'true') {
    throw new Error('COOKIE_SECURE must be "true" when NODE_ENV=production, so the session cookie is sent over HTTPS only. Serve the app behind HTTPS.');
  }
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const production = env.NODE_ENV === 'production';
  const port = integer(env.PORT, 3000, 'PORT');
  if (production) checkDeploymentDefaults(env);
  return {
    port,
    appUrl: (env.APP_URL ?? `http://127.0.0.1:${port}`).replace(/\/$/, ''),
    production,
    db: {
      host: env.PGHOST ?? '127.0.0.1',
      port: integer(env.PGPORT, 54329, 'PGPORT'),
      user: env.PGUSER ?? 'tallyhood',
      password: env.PGPASSWORD ?? 'tallyhood',
      dbName: env.PGDATABASE ?? 'tallyhood',
    },
    sessionSecret: env.SESSION_SECRET ?? DEVELOPMENT_SESSION_SECRET,
    secureCookies: env.COOKIE_SECURE === 'true',
    smtp: {
      host: env.SMTP_HOST ?? '127.0.0.1',
      port: integer(env.SMTP_PORT, 2525, 'SMTP_PORT'),
      from: env.MAIL_FROM ?? 'Tallyhood <no-reply@tallyhood.test>',
    },
    clientDist: env.CLIENT_DIST ?? path.resolve(__dirname, '../../dist/tallyhood/browser'),
    // Any S3-compatible store; the defaults reach the local fake that npm start and npm test run.
    storage: {
      endpoint: env.S3_ENDPOINT ?? 'http://127.0.0.1:4569',
      region: env.S3_REGION ?? 'us-east-1',
      bucket: env.S3_BUCKET ?? 'tallyhood-documents',
      accessKeyId: env.S3_ACCESS_KEY_ID ?? 'S3RVER',
      secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? 'S3RVER',
      forcePathStyle: env.S3_FORCE_PATH_STYLE !== 'false',
    },
    inbox: { domain: mailDomain(env.RECEIPTS_DOMAIN), webhookSecret: webhookSecret(env.INBOUND_MAIL_SECRET) },
  };
}
