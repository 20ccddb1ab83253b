import type { MeterProfileListQuery, SavedMeterProfile, SaveMeterProfileRequest } from '../../shared/schemas/savedMeterProfile';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { countMeterProfiles, deleteMeterProfile, findMeterProfile, insertMeterProfile, listMeterProfiles, type MeterProfileRow } from '../db/meterProfileRepository';
import { findProject } from '../db/projectRepository';
import { AppError, forbidden, notFound } from '../errors';

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

/** Another person's account profile is private: it is "not found" rather than forbidden, except to admins. */
const visibleTo = (user: User, row: MeterProfileRow) => row.scope === 'project' || row.createdById === user.id || user.role === 'admin';

export async function meterProfilesFor(ctx: AppContext, user: User, q: MeterProfileListQuery): Promise<SavedMeterProfile[]> {
  return (await listMeterProfiles(ctx.db, user.id, q.projectId ?? null)).map((r) => toSaved(user, r));
}

/** Engineers and admins save into a project; anyone saves into their own account. */
export async function saveMeterProfile(ctx: AppContext, user: User, req: SaveMeterProfileRequest): Promise<SavedMeterProfile> {
  if (req.scope === 'project') {
    if (user.role === 'viewer') throw forbidden('Viewers keep meter profiles in their own account; a project profile needs an engineer or admin');
    if (!(await findProject(ctx.db, req.projectId!))) throw notFound('Project');
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
  if (!row || !visibleTo(user, row)) throw notFound('Meter profile');
  if (!mayDelete(user, row)) throw forbidden('Only its creator or an admin may delete this meter profile');
  await deleteMeterProfile(ctx.db, id);
}
