import type { Database } from '../db/client';
import { seedDemoTeam } from './demoTeam';
import { seedBuiltinMaterials } from './materials';
import { seedDemoJob } from './demoJob';

/** everything the start command puts in a new database; safe to run on every start */
export async function seedDemo(db: Database): Promise<void> {
  const teamId = await seedDemoTeam(db);
  await seedBuiltinMaterials(db);
  await seedDemoJob(db, teamId, 'demo-engineer');
}
