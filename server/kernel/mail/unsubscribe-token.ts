import { createHmac, timingSafeEqual } from 'node:crypto';
import { MailKind } from '../../contracts/mail.js';

// A link in a mail that turns one kind of mail off without signing in: who, which kind and until
// when, signed with the server's secret (HMAC-SHA256) so it cannot be made up or altered.

const VALID_FOR_MS = 90 * 24 * 3600 * 1000;

const signature = (payload: string, secret: string) => createHmac('sha256', `unsubscribe:${secret}`).update(payload).digest('base64url');

export function unsubscribeToken(userId: string, kind: MailKind, secret: string, now = new Date()): string {
  const payload = Buffer.from(JSON.stringify({ u: userId, k: kind, e: now.getTime() + VALID_FOR_MS })).toString('base64url');
  return `${payload}.${signature(payload, secret)}`;
}

export type TokenCheck = { ok: true; userId: string; kind: MailKind } | { ok: false; reason: 'forged' | 'expired' };

export function readUnsubscribeToken(token: string, secret: string, now = new Date()): TokenCheck {
  const [payload = '', mac = ''] = token.split('.');
  const expected = Buffer.from(signature(payload, secret));
  const given = Buffer.from(mac);
  if (!payload || given.length !== expected.length || !timingSafeEqual(given, expected)) return { ok: false, reason: 'forged' };
  try {
    const body = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as { u: string; k: string; e: number };
    const kind = MailKind.safeParse(body.k);
    if (!kind.success || typeof body.u !== 'string') return { ok: false, reason: 'forged' };
    if (body.e < now.getTime()) return { ok: false, reason: 'expired' };
    return { ok: true, userId: body.u, kind: kind.data };
  } catch {
    return { ok: false, reason: 'forged' };
  }
}
