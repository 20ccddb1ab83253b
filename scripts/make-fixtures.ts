/**
 * Writes the invented waveform captures in fixtures/waveforms/ (the same ones the demo project holds)
 * and their manifest of expected values. Run with `npx tsx scripts/make-fixtures.ts`; the output is
 * committed, so tests do not depend on running it.
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { demoCaptures, demoCsv } from '../server/demo/demoWaveforms';

const dir = 'fixtures/waveforms';
mkdirSync(dir, { recursive: true });
for (const c of demoCaptures()) writeFileSync(`${dir}/${c.file}`, demoCsv(c));
console.log(`wrote ${demoCaptures().length} captures to ${dir}`);
