import type { FrontEndProfile } from '../../shared/schemas/meterSimulation';
import type { Db } from './client';
import { insertMeterProfile } from './meterProfileRepository';

/**
 * Invented presets named for the kinds of meter a team keeps, never for a make. Their time constants
 * and display rates are typical of each kind (common practice, no source), not any product's.
 */
export const DEMO_METER_PROFILES: { name: string; profile: FrontEndProfile }[] = [
  {
    name: 'Handheld average-responding, 3 readings/s',
    profile: { type: 'averaging', coupling: 'ac', couplingTauS: 1, averagingTauS: 0.3, rectifier: 'full', displayRateHz: 3, counts: 4000 },
  },
  {
    name: 'Handheld true RMS, 6000 counts, 5 readings/s',
    profile: { type: 'trueRms', coupling: 'ac', couplingTauS: 1, averagingTauS: 0.8, displayRateHz: 5, counts: 6000, crestFactorLimit: 3, rmsConverter: 'implicit' },
  },
  {
    name: 'Bench true RMS AC+DC, slow filter, 2 readings/s',
    profile: { type: 'trueRms', coupling: 'dc', averagingTauS: 1, filterOrder: 2, displayRateHz: 2, counts: 1_200_000, rmsConverter: 'explicit' },
  },
  {
    name: 'Panel peak-responding, half-wave hold',
    profile: { type: 'peak', coupling: 'ac', couplingTauS: 0.5, averagingTauS: 2, rectifier: 'half', chargeTauS: 0.0005, displayRateHz: 2, counts: 2000 },
  },
];

/** Files the presets under the demo project, as its engineer saved them. */
export async function seedMeterProfiles(db: Db, projectId: number, engineerId: number): Promise<void> {
  for (const p of DEMO_METER_PROFILES) await insertMeterProfile(db, { ...p, scope: 'project', projectId, createdBy: engineerId });
}
