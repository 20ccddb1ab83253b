import type { ChannelSetup } from '../../shared/schemas/channelSetup';
import type { SystemSpec } from '../../shared/schemas/threePhase';
import type { Db } from '../db/client';
import type { findCaptureRow } from '../db/captureRepository';
import { findProject } from '../db/projectRepository';
import type { Declared } from '../workers/ingestTask';

type CaptureRow = NonNullable<Awaited<ReturnType<typeof findCaptureRow>>>;

const parse = <T>(v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v) as T;

/**
 * What a run applies besides the file: the channel setups, the three-phase sets a user stated, and the
 * declared voltage (the capture's, else its project's). Compared before and after a run to see whether
 * a change arrived meanwhile.
 */
export async function runSetupOf(db: Db, capture: CaptureRow): Promise<{ channelSetup: ChannelSetup[]; systems: SystemSpec[] | null; declared: Declared }> {
  const projectVoltage = capture.declaredVoltage === null ? ((await findProject(db, capture.projectId))?.declaredVoltage ?? null) : null;
  const declared: Declared =
    capture.declaredVoltage !== null ? { value: capture.declaredVoltage, from: 'capture' } : projectVoltage !== null ? { value: projectVoltage, from: 'project' } : null;
  return { channelSetup: parse<ChannelSetup[]>(capture.channelSetup) ?? [], systems: parse<SystemSpec[] | null>(capture.systems) ?? null, declared };
}
