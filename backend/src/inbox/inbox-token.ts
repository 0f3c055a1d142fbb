// A build's inbox token: 128 random bits in hex, so an address cannot be guessed; and the address made from it.
import { randomBytes } from 'node:crypto';

const TOKEN = /^[0-9a-f]{32}$/;

export function newInboxToken(): string {
  return randomBytes(16).toString('hex');
}

export function inboxAddress(token: string, domain: string): string {
  return `${token}@${domain}`;
}

/**
 * The token of an address in the receipts domain, or null for any other address. Case is ignored (some mail
 * systems upper-case local parts) and a "+tag" after the token is allowed, as many providers allow it.
 */
export function tokenOfAddress(address: string, domain: string): string | null {
  const at = address.lastIndexOf('@');
  if (at < 0 || address.slice(at + 1).toLowerCase() !== domain) return null;
  const token = address.slice(0, at).toLowerCase().split('+')[0];
  return TOKEN.test(token) ? token : null;
}
