import { MailDev } from 'maildev';

export interface MailInbox {
  smtpPort: number;
  webUrl: string;
  /** The messages received so far, as the inbox's own API gives them. */
  messages(): Promise<InboxMessage[]>;
  /** A message as it arrived (headers and body, RFC 5322). */
  source(id: string): Promise<string>;
  stop(): Promise<void>;
}

export interface InboxMessage {
  id: string;
  subject: string;
  text: string;
  html: string;
  to: Array<{ address: string }>;
  headers: Record<string, string>;
}

/**
 * A local SMTP server with a web inbox (maildev) on loopback, for development, the demo and
 * tests: every mail Decant sends lands here and nothing leaves the machine. Kept in memory.
 */
export async function startMailInbox(smtpPort: number, webPort: number): Promise<MailInbox> {
  const inbox = new MailDev({ smtp: smtpPort, web: webPort, ip: '127.0.0.1', webIp: '127.0.0.1', silent: true } as never);
  await inbox.start();
  const webUrl = `http://127.0.0.1:${webPort}`;
  return {
    smtpPort,
    webUrl,
    async messages() {
      const response = await fetch(`${webUrl}/api/email`);
      return (await response.json()) as InboxMessage[];
    },
    async source(id) {
      return (await fetch(`${webUrl}/api/email/${encodeURIComponent(id)}/source`)).text();
    },
    stop: () => inbox.stop(),
  };
}
