import express, { Router } from 'express';
import type { DataSource } from 'typeorm';
import { MailPreferences, MailPreferenceUpdate, mailKindWords } from '../../contracts/mail.js';
import { endpoint } from '../../http/endpoint.js';
import { readUnsubscribeToken } from '../../kernel/mail/unsubscribe-token.js';
import { MailPreferencesService } from './mail-preferences.service.js';

/** Each person's choices of how each kind of mail reaches them. */
export function mailPreferencesRoutes(dataSource: DataSource): Router {
  const router = Router();
  const preferences = new MailPreferencesService(dataSource);
  router.get('/', ...endpoint({ action: 'signed-in', response: MailPreferences }, ({ user }) => preferences.get(user)));
  router.put(
    '/',
    ...endpoint({ action: 'signed-in', body: MailPreferenceUpdate, response: MailPreferences }, ({ user, body }) =>
      preferences.update(user, body),
    ),
  );
  return router;
}

const page = (title: string, body: string) => `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${title} · Decant</title></head>
<body style="font-family: sans-serif; max-width: 36rem; margin: 3rem auto; padding: 0 1rem; line-height: 1.5"><h1 style="font-size: 1.4rem">${title}</h1>${body}</body></html>`;

const refusedPage = (reason: 'forged' | 'expired') =>
  page(
    'This link does not work',
    reason === 'expired'
      ? '<p>The link has expired. Nothing was changed. Sign in to Decant to choose which mails you receive.</p>'
      : '<p>The link is not one Decant made, or it was altered. Nothing was changed.</p>',
  );

/**
 * The link at the foot of every mail: no sign-in, the signed token says who and which kind.
 * GET shows what will happen (mail scanners open links); POST does it, from the page's button or
 * as the one-click unsubscribe of RFC 8058 (List-Unsubscribe-Post).
 */
export function unsubscribeRoutes(dataSource: DataSource, secret: string): Router {
  const router = Router();
  const preferences = new MailPreferencesService(dataSource);
  const check = (token: unknown) => readUnsubscribeToken(typeof token === 'string' ? token : '', secret);
  router.get('/', (req, res) => {
    const result = check(req.query.token);
    if (!result.ok) return void res.status(400).type('html').send(refusedPage(result.reason));
    const token = String(req.query.token).replace(/"/g, '&quot;');
    res
      .type('html')
      .send(
        page(
          `Stop “${mailKindWords[result.kind].title}” mails`,
          `<p>${mailKindWords[result.kind].detail}.</p><form method="post"><input type="hidden" name="token" value="${token}"><button type="submit">Stop these mails</button></form>`,
        ),
      );
  });
  router.post('/', express.urlencoded({ extended: false, limit: '4kb' }), async (req, res) => {
    const result = check(req.body?.token ?? req.query.token);
    if (!result.ok) return void res.status(400).type('html').send(refusedPage(result.reason));
    const outcome = await preferences.unsubscribe(result.userId, result.kind);
    if (outcome === 'unknown-person') return void res.status(400).type('html').send(refusedPage('forged'));
    if (outcome === 'mandatory') {
      const words = `${mailKindWords[result.kind].title}: a coordinator must hear of it at once, so it cannot be turned off. Nothing was changed.`;
      return void res
        .status(409)
        .type('html')
        .send(page('These mails stay on', `<p>${words}</p>`));
    }
    const words = `You will no longer receive “${mailKindWords[result.kind].title}” mails. You can turn them on again in Decant, under Mail.`;
    res.type('html').send(page('Done', `<p>${words}</p>`));
  });
  return router;
}
