// The deployment checks of config.ts: a production start refuses the development defaults, naming the variable.
import { loadConfig } from './config';

const OWN_SECRET = 'k3v9-a-secret-of-our-own-for-this-test-only-0042';

describe('loadConfig outside development', () => {
  it('refuses to start without a session secret, or with the built-in one', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', COOKIE_SECURE: 'true' })).toThrow(/^SESSION_SECRET must be set to a secret of your own/);
    expect(() => loadConfig({ NODE_ENV: 'production', COOKIE_SECURE: 'true', SESSION_SECRET: 'tallyhood-development-session-secret' })).toThrow(
      /^SESSION_SECRET must be set to a secret of your own/,
    );
  });

  it('refuses a short session secret', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', COOKIE_SECURE: 'true', SESSION_SECRET: 'short' })).toThrow('SESSION_SECRET must be at least 32 characters');
  });

  it('refuses to start without Secure cookies', () => {
    expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: OWN_SECRET })).toThrow(/^COOKIE_SECURE must be "true" when NODE_ENV=production/);
    expect(() => loadConfig({ NODE_ENV: 'production', SESSION_SECRET: OWN_SECRET, COOKIE_SECURE: 'false' })).toThrow(/^COOKIE_SECURE/);
  });

  it('starts with its own secret and Secure cookies', () => {
    const config = loadConfig({ NODE_ENV: 'production', SESSION_SECRET: OWN_SECRET, COOKIE_SECURE: 'true' });
    expect(config.production).toBe(true);
    expect(config.secureCookies).toBe(true);
    expect(config.sessionSecret).toBe(OWN_SECRET);
  });

  it('keeps the development defaults in development and tests', () => {
    for (const NODE_ENV of [undefined, 'development', 'test']) {
      const config = loadConfig({ NODE_ENV });
      expect(config.secureCookies).toBe(false);
      expect(config.sessionSecret).toBe('tallyhood-development-session-secret');
    }
  });
});

describe('loadConfig for the inbox', () => {
  it('defaults the receipts domain and keeps the webhook off without a secret', () => {
    expect(loadConfig({}).inbox).toEqual({ domain: 'receipts.localhost', webhookSecret: null });
    expect(loadConfig({ RECEIPTS_DOMAIN: 'Receipts.Example.COM' }).inbox.domain).toBe('receipts.example.com');
  });

  it('refuses a domain that is not one, and a short webhook secret, naming the variable', () => {
    expect(() => loadConfig({ RECEIPTS_DOMAIN: 'not a domain' })).toThrow(/^RECEIPTS_DOMAIN must be a mail domain/);
    expect(() => loadConfig({ RECEIPTS_DOMAIN: 'localhost' })).toThrow(/^RECEIPTS_DOMAIN/);
    expect(() => loadConfig({ INBOUND_MAIL_SECRET: 'short' })).toThrow(/^INBOUND_MAIL_SECRET must be at least 32 characters/);
    expect(loadConfig({ INBOUND_MAIL_SECRET: OWN_SECRET }).inbox.webhookSecret).toBe(OWN_SECRET);
  });
});
