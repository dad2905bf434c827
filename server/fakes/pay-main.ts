import { loadConfig } from '../config.js';
import { startFakePay } from './pay.js';

// The local payment provider for `npm start`: API on WARPMETER_PAY_PORT, events signed with the
// app's webhook secret and sent to the app's webhook route.
const config = loadConfig();
const webhookUrl = `${config.publicUrl}/api/billing/webhook`;
const fake = await startFakePay({ port: config.pay.port, webhookUrl, webhookSecret: config.pay.webhookSecret });
console.log(`fake payment provider on ${fake.url} (control: ${fake.url}/_fake/state), webhooks to ${webhookUrl}`);
const stop = () => fake.close().then(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);
