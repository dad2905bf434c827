import { startFakeSmtp } from './smtp.js';

const smtpPort = Number(process.env.WARPMETER_SMTP_PORT ?? 3025);
const httpPort = Number(process.env.WARPMETER_MAILBOX_PORT ?? 3026);
const fake = await startFakeSmtp({ smtpPort, httpPort });
console.log(`fake SMTP on 127.0.0.1:${fake.smtpPort}, caught mail at http://127.0.0.1:${fake.httpPort}/`);
const stop = () => fake.close().then(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
