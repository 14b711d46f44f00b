import { loadConfig } from '../config/env.js';
import { startMailInbox } from './mail-inbox.js';

const config = loadConfig();
const inbox = await startMailInbox(Number(new URL(config.smtpUrl).port), Number(new URL(config.mailInboxUrl!).port));
console.log(`Mail inbox: SMTP on 127.0.0.1:${inbox.smtpPort}, read it at ${inbox.webUrl}`);
const stop = () => void inbox.stop().then(() => process.exit(0));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
