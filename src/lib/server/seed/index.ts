import type { Database } from '../db/client';
import { seedDemoTeam } from './demoTeam';

/** everything the start command puts in a new database; safe to run on every start */
export async function seedDemo(db: Database): Promise<void> {
  await seedDemoTeam(db);
}
