// The fake mail server each test app sends through, found from the app, and the links read out of its mail.
import type { Express } from 'express';
import type { FakeMailServer } from '../../backend/src/mail/fake-mail-server';

const mailOfApp = new WeakMap<Express, FakeMailServer>();

export function rememberMailOf(app: Express, mail: FakeMailServer): void {
  mailOfApp.set(app, mail);
}

export function caughtMailOf(app: Express): FakeMailServer {
  const mail = mailOfApp.get(app);
  if (!mail) throw new Error('This app was not started by startTestApp, so its mail is not caught.');
  return mail;
}

export const SIGN_UP_LINK_SUBJECT = 'Finish creating your Tallyhood account';

/**
 * The token of the oldest sign-up link mailed to `email` not yet read. The mail is taken out of the caught ones, as a
 * person files a mail away: a test that then waits for "the mail to this address" gets the next one (an invite, a reset).
 */
export async function signUpToken(mail: FakeMailServer, email: string): Promise<string> {
  const address = email.toLowerCase();
  const found = await mail.waitFor((m) => m.to.includes(address) && m.subject === SIGN_UP_LINK_SUBJECT);
  mail.messages.splice(mail.messages.indexOf(found), 1);
  const match = /\/sign-up\/confirm\/([A-Za-z0-9_-]+)/.exec(found.text);
  if (!match) throw new Error(`no sign-up link in: ${found.text}`);
  return match[1];
}
