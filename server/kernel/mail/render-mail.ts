import { mailKindWords, type MailKind } from '../../contracts/mail.js';
import type { MailContent } from './outbox.js';

const escapeHtml = (text: string) =>
  text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

/** A queued mail as plain text and simple HTML, with the record's link and the way to stop this kind. */
export function renderMail(content: MailContent, kind: MailKind, links: { record: string; unsubscribe: string } | null) {
  if (!links)
    return {
      subject: content.subject,
      text: content.lines.join('\n\n'),
      html: `<!doctype html><html><body style="font-family: sans-serif; line-height: 1.4">\n${content.lines.map((line) => `<p>${escapeHtml(line)}</p>`).join('\n')}\n</body></html>`,
    };
  const what = mailKindWords[kind].title.toLowerCase();
  const footer = `You receive this because of your mail choices in Decant ("${mailKindWords[kind].title}"). To stop mails of this kind: ${links.unsubscribe}`;
  const text = [...content.lines, `${content.linkText}: ${links.record}`, '--', footer].join('\n\n');
  const html = `<!doctype html><html><body style="font-family: sans-serif; line-height: 1.4">
${content.lines.map((line) => `<p>${escapeHtml(line)}</p>`).join('\n')}
<p><a href="${escapeHtml(links.record)}">${escapeHtml(content.linkText)}</a></p>
<hr><p style="font-size: 12px; color: #444">You receive this because of your mail choices in Decant (${escapeHtml(what)}).
<a href="${escapeHtml(links.unsubscribe)}">Stop mails of this kind</a>.</p>
</body></html>`;
  return { subject: content.subject, text, html };
}
