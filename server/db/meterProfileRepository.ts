import { and, asc, count, eq, or, type SQL } from 'drizzle-orm';
import type { FrontEndProfile } from '../../shared/schemas/meterSimulation';
import type { MeterProfileScope } from '../../shared/schemas/savedMeterProfile';
import type { Db } from './client';
import { meterProfiles, users } from './schema';

export interface MeterProfileRow {
  id: number;
  name: string;
  scope: MeterProfileScope;
  projectId: number | null;
  profile: FrontEndProfile;
  createdById: number;
  createdByName: string;
  createdAt: Date;
}

const columns = {
  id: meterProfiles.id,
  name: meterProfiles.name,
  scope: meterProfiles.scope,
  projectId: meterProfiles.projectId,
  profile: meterProfiles.profile,
  createdById: meterProfiles.createdBy,
  createdByName: users.name,
  createdAt: meterProfiles.createdAt,
};

// mysql2 hands JSON columns back parsed from MySQL but as text from MariaDB.
const toRow = (r: Omit<MeterProfileRow, 'profile'> & { profile: unknown }): MeterProfileRow => ({
  ...r,
  profile: (typeof r.profile === 'string' ? JSON.parse(r.profile) : r.profile) as FrontEndProfile,
});

function select(db: Db, where: SQL | undefined) {
  return db.select(columns).from(meterProfiles).innerJoin(users, eq(users.id, meterProfiles.createdBy)).where(where);
}

/** The user's account profiles and the project profiles of `projectId` (of every project when null), by name. */
export async function listMeterProfiles(db: Db, userId: number, projectId: number | null): Promise<MeterProfileRow[]> {
  const own = and(eq(meterProfiles.scope, 'account'), eq(meterProfiles.createdBy, userId));
  const team = projectId === null ? eq(meterProfiles.scope, 'project') : and(eq(meterProfiles.scope, 'project'), eq(meterProfiles.projectId, projectId));
  return (await select(db, or(own, team)).orderBy(asc(meterProfiles.scope), asc(meterProfiles.name), asc(meterProfiles.id))).map(toRow);
}

export async function findMeterProfile(db: Db, id: number): Promise<MeterProfileRow | null> {
  const [row] = await select(db, eq(meterProfiles.id, id));
  return row ? toRow(row) : null;
}

export async function insertMeterProfile(db: Db, p: { name: string; scope: MeterProfileScope; projectId: number | null; createdBy: number; profile: FrontEndProfile }): Promise<number> {
  const [{ id }] = await db.insert(meterProfiles).values(p).$returningId();
  return id;
}

export async function deleteMeterProfile(db: Db, id: number): Promise<void> {
  await db.delete(meterProfiles).where(eq(meterProfiles.id, id));
}

/** How many profiles a project holds, or one person keeps in their account. */
export async function countMeterProfiles(db: Db, owner: { projectId: number } | { userId: number }): Promise<number> {
  const where = 'projectId' in owner
    ? and(eq(meterProfiles.scope, 'project'), eq(meterProfiles.projectId, owner.projectId))
    : and(eq(meterProfiles.scope, 'account'), eq(meterProfiles.createdBy, owner.userId));
  const [{ n }] = await db.select({ n: count() }).from(meterProfiles).where(where);
  return Number(n);
}
