import 'reflect-metadata';
import { loadConfig } from '../config.js';
import { createDataSource } from '../data-source.js';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_STUDIO_NAME } from './demo-studio.js';
import { seedDemo } from './index.js';

// `npm start` runs this before the app starts: migrate, then make sure the demo studio exists.
const config = loadConfig();
const ds = createDataSource(config.db);
await ds.initialize();
try {
  await ds.runMigrations({ transaction: 'each' });
  await seedDemo(ds);
} finally {
  await ds.destroy();
}
console.log(`Demo studio "${DEMO_STUDIO_NAME}" is ready. Open ${config.publicUrl} and sign in with password "${DEMO_PASSWORD}" as:`);
for (const p of DEMO_PEOPLE) console.log(`  ${p.role.padEnd(13)} ${p.email.padEnd(24)} (${p.name})`);
