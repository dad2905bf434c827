import type { DataSource } from 'typeorm';
import { seedDemoSubscription } from '../billing/demo-seed.js';
import { seedDemoAudits } from '../jobs/demo-audits.js';
import { seedDemoReview } from '../signoff/demo-review.js';
import { seedDemoProjects } from './demo-projects.js';
import { seedDemoStudio, type DemoContext } from './demo-studio.js';

export type { DemoContext } from './demo-studio.js';

/** A step that adds demo content on top of the demo studio; must be idempotent like the rest. */
export type DemoSeeder = (ctx: DemoContext) => Promise<void>;

/**
 * Extra demo seeders, run in this order after the studio and its people exist.
 * Features add theirs here (e.g. demo projects, regions and audits): import the seeder and
 * append it to this array.
 */
export const extraDemoSeeders: DemoSeeder[] = [
  seedDemoSubscription,
  seedDemoProjects,
  // Keep after the project seeders: it computes an audit for each demo project they created.
  seedDemoAudits,
  // Needs the audits above: sends the first finished one's best candidates to the demo reviewer.
  seedDemoReview,
];

/** Seeds the whole demo: the studio, its people, then every extra seeder. */
export async function seedDemo(ds: DataSource): Promise<DemoContext> {
  const ctx = await seedDemoStudio(ds);
  for (const seeder of extraDemoSeeders) await seeder(ctx);
  return ctx;
}
