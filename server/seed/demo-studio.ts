import type { DataSource } from 'typeorm';
import type { Role } from '../../shared/api/roles.js';
import { Studio } from '../entities/index.js';
import { hashPassword } from '../services/auth.service.js';
import { addMember } from '../services/people.service.js';

/** A made-up studio for trying Warpmeter out; nothing here is a real firm or person. */
export const DEMO_STUDIO_NAME = 'Meridian & Vale Cartography';
export const DEMO_SEAT_COUNT = 5;
/** One shared password for every demo account (local demos only). */
export const DEMO_PASSWORD = 'warpmeter-demo';

export const DEMO_PEOPLE: readonly { role: Role; email: string; name: string }[] = [
  { role: 'admin', email: 'admin@warpmeter.test', name: 'Rosa Vale' },
  { role: 'cartographer', email: 'carto@warpmeter.test', name: 'Kofi Mensah' },
  { role: 'editor', email: 'editor@warpmeter.test', name: 'Hana Sato' },
  { role: 'client', email: 'client@warpmeter.test', name: 'Lena Brandt' },
];

export interface DemoPerson {
  email: string;
  name: string;
  userId: number;
  membershipId: number;
}

/** What later demo seeders build on. */
export interface DemoContext {
  ds: DataSource;
  studioId: number;
  people: Record<Role, DemoPerson>;
}

/**
 * Creates the demo studio and its four people if they are missing; running it again changes
 * nothing (an existing account keeps its password, an existing studio its seat count).
 */
export async function seedDemoStudio(ds: DataSource): Promise<DemoContext> {
  return ds.transaction(async (m) => {
    const studios = m.getRepository(Studio);
    const studio =
      (await studios.findOne({ where: { name: DEMO_STUDIO_NAME }, order: { id: 'ASC' } })) ??
      (await studios.save(studios.create({ name: DEMO_STUDIO_NAME, seatCount: DEMO_SEAT_COUNT })));
    const passwordHash = await hashPassword(DEMO_PASSWORD);
    const people = {} as Record<Role, DemoPerson>;
    for (const p of DEMO_PEOPLE) {
      const ids = await addMember(m, { studioId: studio.id, email: p.email, name: p.name, passwordHash, role: p.role });
      people[p.role] = { email: p.email, name: p.name, ...ids };
    }
    return { ds, studioId: studio.id, people };
  });
}
