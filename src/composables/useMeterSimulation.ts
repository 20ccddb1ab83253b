import { computed, ref, watch, type Ref } from 'vue';
import type { FrontEndProfile, MeterSimulationResponse } from '../../shared/schemas/meterSimulation';
import type { MeterProfileScope, SavedMeterProfile } from '../../shared/schemas/savedMeterProfile';
import * as profilesApi from '../api/meterProfiles';
import { simulateMeter } from '../api/meterSimulation';
import { useAsync } from './useAsync';

/** A typical handheld, to start from when the team has saved no profile yet. */
export const STARTER_PROFILE: FrontEndProfile = { type: 'averaging', coupling: 'ac', couplingTauS: 1, averagingTauS: 0.3, rectifier: 'full', displayRateHz: 3, counts: 4000 };

/**
 * The meter-in-time panel's data: the saved profiles of the capture's project (and the user's own),
 * the profile being tried, and the simulation of it on the chosen channel. A newer simulation
 * supersedes one still on its way, so a quick change of profile never shows a stale answer.
 */
export function useMeterSimulation(captureId: number, projectId: number, channel: Ref<number>) {
  const { run, loading } = useAsync();
  const profiles = ref<SavedMeterProfile[]>([]);
  const selectedId = ref<number | null>(null);
  const profile = ref<FrontEndProfile>({ ...STARTER_PROFILE });
  const repeat = ref(true);
  const start = ref<'connected' | 'settled'>('connected');
  const result = ref<MeterSimulationResponse | null>(null);
  let seq = 0;

  async function loadProfiles() {
    const r = await run(() => profilesApi.listMeterProfiles(projectId));
    if (r) profiles.value = r.items;
  }

  async function simulate() {
    const mine = ++seq;
    const r = await run(() => simulateMeter(captureId, { channel: channel.value, profile: profile.value, start: start.value, ...(repeat.value ? { repeat: true as const } : {}) }));
    if (r && mine === seq) result.value = r;
  }

  function pick(id: number | null) {
    selectedId.value = id;
    const saved = profiles.value.find((p) => p.id === id);
    if (saved) profile.value = { ...saved.profile };
    void simulate();
  }

  async function save(name: string, scope: MeterProfileScope) {
    const saved = await run(() => profilesApi.saveMeterProfile({ name, scope, ...(scope === 'project' ? { projectId } : {}), profile: profile.value }), { success: 'Meter profile saved' });
    if (!saved) return;
    await loadProfiles();
    selectedId.value = saved.id;
  }

  async function remove(id: number) {
    const done = await run(async () => {
      await profilesApi.deleteMeterProfile(id);
      return true;
    }, { success: 'Meter profile deleted' });
    if (!done) return;
    if (selectedId.value === id) selectedId.value = null;
    await loadProfiles();
  }

  const selected = computed(() => profiles.value.find((p) => p.id === selectedId.value) ?? null);
  watch([channel, repeat, start], () => result.value && void simulate());

  return { profiles, selectedId, selected, profile, repeat, start, result, loading, loadProfiles, simulate, pick, save, remove };
}
