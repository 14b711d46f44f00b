import { startSmtpFake } from './smtp-fake.js';

const port = Number(process.env.SMTP_PORT ?? 4282);
const smtp = await startSmtpFake(port, (message) => {
  const subject = /^Subject: (.*)$/m.exec(message.raw)?.[1] ?? '(no subject)';
  console.log(`[mail] to ${message.to.join(', ')}: ${subject}`);
});
console.log(`SMTP fake listening on 127.0.0.1:${smtp.port}`);
const stop = () => void smtp.close().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
