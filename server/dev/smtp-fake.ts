import { SMTPServer } from 'smtp-server';

export interface CapturedMessage {
  from: string;
  to: string[];
  raw: string;
  receivedAt: Date;
}

/**
 * A local SMTP sink for development and tests: accepts every message on loopback and keeps it
 * in memory (and prints a line), so nothing ever leaves the machine.
 */
export function startSmtpFake(port: number, onMessage?: (message: CapturedMessage) => void) {
  const messages: CapturedMessage[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const message: CapturedMessage = {
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map((rcpt) => rcpt.address),
          raw: Buffer.concat(chunks).toString('utf8'),
          receivedAt: new Date(),
        };
        messages.push(message);
        onMessage?.(message);
        callback();
      });
    },
  });
  return new Promise<{ messages: CapturedMessage[]; port: number; close(): Promise<void> }>((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, '127.0.0.1', () => {
      const address = server.server.address();
      resolve({
        messages,
        port: typeof address === 'object' && address ? address.port : port,
        close: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}
