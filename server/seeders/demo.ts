import type { Orm } from '../db';
import { hashPassword } from '../modules/auth/passwords';
import { Organization } from '../modules/users/organization.entity';
import { User } from '../modules/users/user.entity';

/** Demo only: listed in README.md. Never use these anywhere real. */
export const DEMO_PASSWORD = 'demo-password-1';
export const DEMO_USERS = [
  { email: 'ines.installer@sightfan-demo.example', name: 'Ines Okafor (demo installer)', role: 'installer' as const },
  { email: 'rafael.reviewer@sightfan-demo.example', name: 'Rafael Lindqvist (demo safety officer)', role: 'reviewer' as const },
  { email: 'ada.admin@sightfan-demo.example', name: 'Ada Moreau (demo admin)', role: 'admin' as const },
];

/**
 * Seeds the invented demo organisation and one user per role, once: if the demo organisation is
 * already there, nothing changes (so a restart keeps whatever people did).
 */
export async function seedDemo(orm: Orm, bcryptCost: number): Promise<boolean> {
  const em = orm.em.fork();
  if (await em.count(Organization, { demo: true })) return false;
  const org = em.create(Organization, { name: 'Harbourline Cold Storage (demo)', demo: true });
  const hash = await hashPassword(DEMO_PASSWORD, bcryptCost);
  for (const u of DEMO_USERS) {
    em.create(User, { ...u, organization: org, passwordHash: hash, disabled: false, units: 'metric' });
  }
  await em.flush();
  return true;
}
