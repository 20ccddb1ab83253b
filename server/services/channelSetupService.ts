import { completeSetup, type ChannelSetup, type ChannelSetupPatch } from '../../shared/schemas/channelSetup';
import type { CaptureDetail } from '../../shared/schemas/capture';
import type { SystemSpec } from '../../shared/schemas/threePhase';
import type { User } from '../../shared/schemas/user';
import type { AppContext } from '../context';
import { channelUnits, saveChannelSetup, saveDeclaredVoltage, saveSystems } from '../db/captureSetupRepository';
import { AppError, notFound } from '../errors';
import { enqueue } from '../jobs/jobQueue';
import { captureDetail, ownedCapture } from './captureService';

type CaptureRow = Awaited<ReturnType<typeof ownedCapture>>;
/** `pending`: a (re-)analysis will apply the change; the figures shown are the old ones until it is done. */
export interface SetupOutcome {
  capture: CaptureDetail;
  pending: boolean;
}

const parse = <T>(v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as T;
const VOLTAGE_UNITS = new Set(['V', 'mV', 'kV']);
const CURRENT_UNITS = new Set(['A', 'mA', 'kA']);

/**
 * Queues a re-analysis of a ready capture (once, however often asked). A capture still waiting for or
 * in its first analysis picks the change up there; a failed one keeps it for its next try.
 */
async function reanalyse(ctx: AppContext, row: CaptureRow): Promise<boolean> {
  if (row.status === 'queued' || row.status === 'processing') return true;
  if (row.status !== 'ready') return false;
  await enqueue(ctx.db, row.id, 'reanalyse');
  return true;
}

/** Checks a channel index against the capture's analysed channels (unknown before its first analysis). */
async function knownChannel(ctx: AppContext, row: CaptureRow, index: number): Promise<void> {
  if (row.status === 'ready' && index >= (await channelUnits(ctx.db, row.id)).length) throw notFound(`Channel ${index}`);
}

/**
 * Changes one channel's setup (name, unit, scale, offset, invert) and has the capture analysed again
 * from its original file, so samples, figures, marks and shares all come out in the new unit. A name
 * alone shows at once; it still re-analyses when the three-phase sets are found from names.
 */
export async function changeChannelSetup(ctx: AppContext, user: User, id: number, index: number, patch: ChannelSetupPatch): Promise<SetupOutcome> {
  const row = await ownedCapture(ctx, user, id);
  await knownChannel(ctx, row, index);
  const setups = parse<ChannelSetup[]>(row.channelSetup) ?? [];
  const next = completeSetup(index, { ...setups.find((s) => s.index === index), ...patch });
  await saveChannelSetup(ctx.db, id, [...setups.filter((s) => s.index !== index), next].sort((a, b) => a.index - b.index), patch.name ? { idx: index, name: patch.name } : undefined);
  const nameOnly = Object.keys(patch).every((k) => k === 'name') && row.systems !== null;
  const pending = nameOnly ? false : await reanalyse(ctx, row);
  return { capture: await captureDetail(ctx, id), pending };
}

/** States the capture's three-phase sets (null: find them automatically again) and re-analyses. */
export async function setSystems(ctx: AppContext, user: User, id: number, systems: SystemSpec[] | null): Promise<SetupOutcome> {
  const row = await ownedCapture(ctx, user, id);
  if (systems && row.status === 'ready') {
    const units = await channelUnits(ctx.db, id);
    systems.forEach((s, k) => {
      const bad = (field: string, ids: number[], allowed: Set<string>, what: string) => {
        const wrong = ids.find((i) => i >= units.length || !allowed.has(units[i]));
        if (wrong !== undefined) throw new AppError(400, 'invalid_request', `${k}.${field}: channel ${wrong} ${wrong >= units.length ? 'does not exist' : `is not a ${what} (its unit is “${units[wrong]}”)`}`);
      };
      bad('voltageChannels', s.voltageChannels, VOLTAGE_UNITS, 'voltage');
      if (s.currentChannels) bad('currentChannels', s.currentChannels, CURRENT_UNITS, 'current');
    });
  }
  await saveSystems(ctx.db, id, systems);
  return { capture: await captureDetail(ctx, id), pending: await reanalyse(ctx, row) };
}

/** Sets the capture's declared voltage for dips and swells (null: the project's, else a suggestion) and re-analyses. */
export async function setDeclaredVoltage(ctx: AppContext, user: User, id: number, volts: number | null): Promise<SetupOutcome> {
  const row = await ownedCapture(ctx, user, id);
  await saveDeclaredVoltage(ctx.db, id, volts);
  return { capture: await captureDetail(ctx, id), pending: await reanalyse(ctx, row) };
}
