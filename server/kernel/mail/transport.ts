import nodemailer from 'nodemailer';

/** The SMTP transport for SMTP_URL; the local inbox on loopback speaks no TLS. */
export function createMailTransport(smtpUrl: string) {
  const url = new URL(smtpUrl);
  if (!['127.0.0.1', 'localhost', '[::1]'].includes(url.hostname)) return nodemailer.createTransport(smtpUrl);
  return nodemailer.createTransport({ host: url.hostname, port: Number(url.port || 25), secure: false, ignoreTLS: true });
}
