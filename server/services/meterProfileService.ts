import type { MeterProfileListQuery, SavedMeterProfile, SaveMeterProfileRequest } from '../../shared/schemas/savedMeterProfile';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { countMeterProfiles, deleteMeterProfile, findMeterProfile, insertMeterProfile, listMeterProfiles, type MeterProfileRow } from '../db/meterProfileRepository';
import { AppError, forbidden, notFound } from '../errors';
import { visibleProject } from './visibility';

/** Enough for any team's meters; a bound so one caller cannot fill the table. */
const MAX_PER_OWNER = 100;

const mayDelete = (user: User, row: MeterProfileRow) => user.role === 'admin' || row.createdById === user.id;

function toSaved(user: User, row: MeterProfileRow): SavedMeterProfile {
  return {
    id: row.id,
    name: row.name,
    scope: row.scope,
    projectId: row.projectId,
    profile: row.profile,
    createdBy: { id: row.createdById, name: row.createdByName },
    createdAt: row.createdAt.toISOString(),
    canDelete: mayDelete(user, row),
  };
}

/** Whether `user` may see the project a project profile belongs to (members-only projects hide theirs). */
async function projectVisible(ctx: AppContext, user: User, projectId: number, seen: Map<number, boolean>): Promise<boolean> {
  if (!seen.has(projectId)) seen.set(projectId, await visibleProject(ctx, user, projectId).then(() => true, () => false));
  return seen.get(projectId)!;
}

/**
 * Whether `user` may see a profile: their own account profiles, and profiles of projects they can see.
 * Another person's account profile, or a hidden project's, is "not found" rather than forbidden.
 */
async function visibleTo(ctx: AppContext, user: User, row: MeterProfileRow, seen = new Map<number, boolean>()): Promise<boolean> {
  if (row.scope === 'account') return row.createdById === user.id || user.role === 'admin';
  return row.projectId !== null && projectVisible(ctx, user, row.projectId, seen);
}

export async function meterProfilesFor(ctx: AppContext, user: User, q: MeterProfileListQuery): Promise<SavedMeterProfile[]> {
  if (q.projectId) await visibleProject(ctx, user, q.projectId);
  const seen = new Map<number, boolean>();
  const rows = await listMeterProfiles(ctx.db, user.id, q.projectId ?? null);
  const shown: SavedMeterProfile[] = [];
  for (const r of rows) if (await visibleTo(ctx, user, r, seen)) shown.push(toSaved(user, r));
  return shown;
}

/** Engineers and admins of the project save into it (their role there, as project membership narrows it); anyone saves into their own account. */
export async function saveMeterProfile(ctx: AppContext, user: User, req: SaveMeterProfileRequest): Promise<SavedMeterProfile> {
  if (req.scope === 'project') {
    const role = await visibleProject(ctx, user, req.projectId!);
    if (role === 'viewer') throw forbidden('Viewers keep meter profiles in their own account; a project profile needs an engineer or admin');
  }
  const owner = req.scope === 'project' ? { projectId: req.projectId! } : { userId: user.id };
  if ((await countMeterProfiles(ctx.db, owner)) >= MAX_PER_OWNER) {
    throw new AppError(409, 'too_many', `A ${req.scope} keeps at most ${MAX_PER_OWNER} meter profiles; delete one first`);
  }
  const id = await insertMeterProfile(ctx.db, { name: req.name, scope: req.scope, projectId: req.projectId ?? null, createdBy: user.id, profile: req.profile });
  return toSaved(user, (await findMeterProfile(ctx.db, id))!);
}

export async function removeMeterProfile(ctx: AppContext, user: User, id: number): Promise<void> {
  const row = await findMeterProfile(ctx.db, id);
  if (!row || !(await visibleTo(ctx, user, row))) throw notFound('Meter profile');
  if (!mayDelete(user, row)) throw forbidden('Only its creator or an admin may delete this meter profile');
  await deleteMeterProfile(ctx.db, id);
}
