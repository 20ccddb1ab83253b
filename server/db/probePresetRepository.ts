import { asc, eq } from 'drizzle-orm';
import type { ChannelUnit, CreateProbePresetRequest, ProbePreset } from '../../shared/schemas/channelSetup';
import type { Db } from './client';
import { probePresets } from './schema';

const toPreset = (r: typeof probePresets.$inferSelect): ProbePreset => ({
  id: r.id,
  projectId: r.projectId,
  name: r.name,
  unit: r.unit as ChannelUnit,
  scale: r.scale,
  offset: r.offset,
  invert: Boolean(r.invert),
  createdBy: r.createdBy ?? null,
});

export async function listProbePresets(db: Db, projectId: number): Promise<ProbePreset[]> {
  return (await db.select().from(probePresets).where(eq(probePresets.projectId, projectId)).orderBy(asc(probePresets.name))).map(toPreset);
}

export async function findProbePreset(db: Db, id: number): Promise<ProbePreset | null> {
  const [row] = await db.select().from(probePresets).where(eq(probePresets.id, id));
  return row ? toPreset(row) : null;
}

export async function insertProbePreset(db: Db, projectId: number, createdBy: number, p: CreateProbePresetRequest): Promise<number> {
  const [{ id }] = await db.insert(probePresets).values({ projectId, createdBy, ...p }).$returningId();
  return id;
}

export async function deleteProbePreset(db: Db, id: number): Promise<void> {
  await db.delete(probePresets).where(eq(probePresets.id, id));
}
