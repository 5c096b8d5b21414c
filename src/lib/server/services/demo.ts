// the demo team's sign-ins, shown on the home page only while the demo team and its people exist
import { and, eq, inArray } from 'drizzle-orm';
import { db } from '../db';
import { memberships, teams, users } from '../db/schema';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_TEAM_NAME } from '../seed/demoTeam';

export interface DemoSignIn {
  name: string;
  email: string;
  role: string;
}

/** ms the answer is kept: the home page is asked often, the demo team rarely changes */
const KEEP_MS = 30_000;
let kept: { at: number; value: { people: DemoSignIn[]; password: string } } | null = null;

/** the demo people still in the demo team with their demo e-mail, and the demo password; none when the team is gone */
export async function demoSignIns(): Promise<{ people: DemoSignIn[]; password: string }> {
  if (kept && Date.now() - kept.at < KEEP_MS) return kept.value;
  let people: DemoSignIn[] = [];
  try {
    const rows = await db
      .select({ id: users.id, name: users.name, email: users.email, role: memberships.role })
      .from(memberships)
      .innerJoin(teams, eq(teams.id, memberships.teamId))
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(teams.name, DEMO_TEAM_NAME), inArray(users.id, DEMO_PEOPLE.map((p) => p.id))));
    people = DEMO_PEOPLE.flatMap((p) => {
      const r = rows.find((x) => x.id === p.id && x.email === p.email);
      return r ? [{ name: r.name, email: r.email, role: r.role }] : [];
    });
  } catch {
    // the database is away: show no sign-ins rather than fail the home page
    return { people: [], password: DEMO_PASSWORD };
  }
  kept = { at: Date.now(), value: { people, password: DEMO_PASSWORD } };
  return kept.value;
}
