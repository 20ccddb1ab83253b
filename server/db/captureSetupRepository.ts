import { and, eq, sql } from 'drizzle-orm';
import type { ChannelSetup } from '../../shared/schemas/channelSetup';
import type { SystemSpec } from '../../shared/schemas/threePhase';
import type { Db } from './client';
import { captures, channels } from './schema';

/** Stores a capture's channel setups; a new name shows at once (it changes no figure). */
export async function saveChannelSetup(db: Db, captureId: number, setups: ChannelSetup[], renamed?: { idx: number; name: string }): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.update(captures).set({ channelSetup: setups }).where(eq(captures.id, captureId));
    if (renamed) await tx.update(channels).set({ name: renamed.name }).where(and(eq(channels.captureId, captureId), eq(channels.idx, renamed.idx)));
  });
}

/** Stores the three-phase sets a user stated, or null to have them found automatically. */
export async function saveSystems(db: Db, captureId: number, systems: SystemSpec[] | null): Promise<void> {
  await db.update(captures).set({ systems }).where(eq(captures.id, captureId));
}

export async function saveDeclaredVoltage(db: Db, captureId: number, volts: number | null): Promise<void> {
  await db.update(captures).set({ declaredVoltage: volts }).where(eq(captures.id, captureId));
}

/** The analysed channels' current units, by index. */
export async function channelUnits(db: Db, captureId: number): Promise<string[]> {
  const rows = await db.select({ idx: channels.idx, unit: channels.unit }).from(channels).where(eq(channels.captureId, captureId)).orderBy(channels.idx);
  return rows.map((r) => r.unit);
}

/** What a trend needs of a capture and one channel, in one query. */
export async function trendSource(db: Db, captureId: number, channel: number) {
  const [row] = await db
    .select({
      status: captures.status,
      sampleCount: captures.sampleCount,
      sampleRate: captures.sampleRate,
      t0: captures.t0,
      channel: channels.idx,
      unit: channels.unit,
      frequency: sql<number | string | null>`JSON_VALUE(${channels.analysis}, '$.frequency')`,
    })
    .from(captures)
    .leftJoin(channels, and(eq(channels.captureId, captures.id), eq(channels.idx, channel)))
    .where(eq(captures.id, captureId));
  return row ?? null;
}
