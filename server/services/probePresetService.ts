import type { CreateProbePresetRequest, ProbePreset } from '../../shared/schemas/channelSetup';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { deleteProbePreset, findProbePreset, insertProbePreset, listProbePresets } from '../db/probePresetRepository';
import { AppError, forbidden, notFound } from '../errors';
import { getProject } from './projectService';

/** At most this many presets per project: a list to pick from, not a catalogue. */
const MAX_PRESETS = 100;

/** The presets of a project the user can see (hidden projects answer 404). */
export async function projectPresets(ctx: AppContext, user: User, projectId: number): Promise<ProbePreset[]> {
  await getProject(ctx, user, projectId);
  return listProbePresets(ctx.db, projectId);
}

export async function createPreset(ctx: AppContext, user: User, projectId: number, req: CreateProbePresetRequest): Promise<ProbePreset> {
  const existing = await projectPresets(ctx, user, projectId);
  if (existing.length >= MAX_PRESETS) throw new AppError(409, 'too_many_presets', `A project keeps at most ${MAX_PRESETS} probe presets; delete one first`);
  if (existing.some((p) => p.name.toLowerCase() === req.name.toLowerCase())) throw new AppError(409, 'duplicate_name', `The project already has a preset named “${req.name}”`);
  return (await findProbePreset(ctx.db, await insertProbePreset(ctx.db, projectId, user.id, req)))!;
}

/** Whoever made a preset, or an admin, may delete it. */
export async function removePreset(ctx: AppContext, user: User, id: number): Promise<void> {
  const preset = await findProbePreset(ctx.db, id);
  if (!preset) throw notFound('Probe preset');
  if (user.role !== 'admin' && preset.createdBy !== user.id) throw forbidden('Only whoever made this preset or an admin may delete it');
  await deleteProbePreset(ctx.db, id);
}
