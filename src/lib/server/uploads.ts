// the team's uploaded hourly outdoor series (uploads table)
import { desc, eq } from 'drizzle-orm';
import { db } from './db';
import { uploads } from './db/schema';
import type { UploadCreate, UploadSummary } from '../schemas/upload';
import type { UploadedSeries } from '../schemas/workbench';

const summary = (r: { id: number; teamId: number; name: string; fileName: string; rowCount: number; mapping: unknown; createdAt: Date }): UploadSummary => ({
  id: r.id,
  teamId: r.teamId,
  name: r.name,
  fileName: r.fileName,
  rowCount: r.rowCount,
  hasIrradiance: ((r.mapping as { irradianceColumn?: number | null } | null)?.irradianceColumn ?? null) !== null,
  createdAt: r.createdAt.toISOString(),
});

/** the team's uploads, newest first, without their series */
export async function listUploads(teamId: number): Promise<UploadSummary[]> {
  const rows = await db
    .select({ id: uploads.id, teamId: uploads.teamId, name: uploads.name, fileName: uploads.fileName, rowCount: uploads.rowCount, mapping: uploads.mapping, createdAt: uploads.createdAt })
    .from(uploads)
    .where(eq(uploads.teamId, teamId))
    .orderBy(desc(uploads.id));
  return rows.map(summary);
}

/** one upload with its series, or null */
export async function getUpload(id: number): Promise<(UploadSummary & { mapping: unknown; series: UploadedSeries }) | null> {
  const rows = await db.select().from(uploads).where(eq(uploads.id, id)).limit(1);
  const r = rows[0];
  if (!r) return null;
  return { ...summary(r), mapping: r.mapping, series: r.series as UploadedSeries };
}

export async function createUpload(teamId: number, userId: string, data: UploadCreate): Promise<UploadSummary> {
  const { teamId: _ignored, ...rest } = data;
  const createdAt = new Date();
  const [row] = await db
    .insert(uploads)
    .values({ teamId, name: rest.name, fileName: rest.fileName, mapping: rest.mapping, series: rest.series, rowCount: rest.series.air.length, createdBy: userId, createdAt })
    .$returningId();
  return summary({ id: row.id, teamId, name: rest.name, fileName: rest.fileName, rowCount: rest.series.air.length, mapping: rest.mapping, createdAt });
}
