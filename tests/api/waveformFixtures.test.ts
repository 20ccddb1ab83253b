/** The whole pipeline (upload, reader, engine, storage) on the invented waveform fixtures, against the closed forms in their manifest. */
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningServer } from '../../server/server';
import { uploadText, waitSettled } from '../helpers/captures';
import { ADMIN, resetDatabase, signedIn, startTestServer } from '../helpers/testServer';

const manifest = JSON.parse(readFileSync('fixtures/waveforms/manifest.json', 'utf8'));
let app: RunningServer;
let admin: Awaited<ReturnType<typeof signedIn>>;
beforeAll(async () => {
  app = await startTestServer({ RUN_WORKER: '1' });
  await resetDatabase(app);
  admin = await signedIn(app, ADMIN.email, ADMIN.password);
});
afterAll(() => app.stop());

describe('waveform fixtures through the whole pipeline', () => {
  for (const f of manifest.captures) {
    it(`${f.file}: ${f.source}`, async () => {
      const up = await uploadText(admin, f.file, readFileSync(`fixtures/waveforms/${f.file}`));
      expect((await waitSettled(admin, up.body.id)).status).toBe('ready');
      const a = (await admin.get(`/api/captures/${up.body.id}/analysis`)).body.channels[f.channel];
      expect(Math.abs(a.rms - f.rms)).toBeLessThan(f.tolerance);
      if (f.averageResponding) expect(Math.abs(a.meters.averageResponding.reading - f.averageResponding)).toBeLessThan(f.tolerance * 2);
    });
  }

  it('the planted anomalies come back as suggestions a viewer can see and an engineer can accept', async () => {
    const up = await uploadText(admin, 'supply-with-anomalies.csv', readFileSync('fixtures/waveforms/supply-with-anomalies.csv'));
    await waitSettled(admin, up.body.id);
    const list = (await admin.get(`/api/captures/${up.body.id}/annotations`)).body.items as { id: number; label: string; state: string; source: string; startS: number }[];
    const labels = list.map((a) => a.label);
    expect(labels).toEqual(expect.arrayContaining(['Sag', 'Spike', 'Clipping']));
    expect(list.every((a) => a.state === 'suggested' && a.source === 'finder')).toBe(true);
    const sag = list.find((a) => a.label === 'Sag')!;
    expect(sag.startS).toBeCloseTo(0.2, 2);
    const accepted = await admin.patch(`/api/annotations/${sag.id}`).send({ state: 'active' });
    expect(accepted.body.state).toBe('active');
    const dismissed = await admin.patch(`/api/annotations/${list.find((a) => a.label === 'Spike')!.id}`).send({ state: 'dismissed' });
    expect(dismissed.status).toBe(200);
    const after = (await admin.get(`/api/captures/${up.body.id}/annotations`)).body.items as { label: string }[];
    expect(after.map((a) => a.label)).not.toContain('Spike');
  });
});
