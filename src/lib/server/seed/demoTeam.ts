import { eq } from 'drizzle-orm';
import type { Database } from '../db/client';
import { users, teams, memberships, type Role } from '../db/schema';
import { hashPassword } from '../auth/password';

/** the demo team's sign-ins, listed in the README; the scenario is our own */
export const DEMO_TEAM_NAME = 'Calder Row Envelope Studio';
export const DEMO_PASSWORD = 'wallpulse-demo';
export const DEMO_PEOPLE: { id: string; email: string; name: string; role: Role }[] = [
  { id: 'demo-admin', email: 'noor@demo.wallpulse.test', name: 'Noor Haddad', role: 'admin' },
  { id: 'demo-engineer', email: 'tomas@demo.wallpulse.test', name: 'Tomas Reyes', role: 'engineer' },
  { id: 'demo-checker', email: 'ingrid@demo.wallpulse.test', name: 'Ingrid Solberg', role: 'checker' },
];

/** make the demo team and its three people once; returns the team id */
export async function seedDemoTeam(db: Database): Promise<number> {
  const existing = await db.select({ id: teams.id }).from(teams).where(eq(teams.name, DEMO_TEAM_NAME)).limit(1);
  if (existing[0]) return existing[0].id;
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const [team] = await db.insert(teams).values({ name: DEMO_TEAM_NAME }).$returningId();
  for (const person of DEMO_PEOPLE) {
    await db
      .insert(users)
      .values({ id: person.id, email: person.email, name: person.name, passwordHash, emailVerifiedAt: new Date() })
      .onDuplicateKeyUpdate({ set: { name: person.name } });
    await db.insert(memberships).values({ teamId: team.id, userId: person.id, role: person.role });
  }
  return team.id;
}
