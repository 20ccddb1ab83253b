/**
 * The COMTRADE steps of `npm run bench`: a binary record written the way a recorder would (1999 layout,
 * int16 values), and the numpy reference that reads the same .dat with numpy.fromfile.
 */
import { createWriteStream, writeFileSync } from 'node:fs';

/** Channels of the bench record: three voltages, three currents, neutral current, residual voltage. */
const CHANNELS = 8;

/**
 * Writes `<base>.cfg` and `<base>.dat`: `rows` records of 8 int16 channels at 10 kS/s, 50 Hz three-phase
 * waveforms with a little harmonic content, and 4 status inputs. Returns the .dat's size in bytes.
 */
export async function writeComtradeBinary(base: string, rows: number): Promise<number> {
  const cfg = [
    'Bench substation,Bench recorder,1999',
    `${CHANNELS + 4},${CHANNELS}A,4D`,
    ...Array.from({ length: CHANNELS }, (_, c) => `${c + 1},${c < 3 || c === 7 ? `V${c}` : `I${c}`},${'ABCABCNN'[c]},Bay 1,${c < 3 || c === 7 ? 'V' : 'A'},0.01,0,0,-32767,32767,1,1,P`),
    ...Array.from({ length: 4 }, (_, d) => `${d + 1},IN${d + 1},,Bay 1,0`),
    '50',
    '1',
    `10000,${rows}`,
    '01/01/2025,00:00:00.000000',
    '01/01/2025,00:00:00.100000',
    'BINARY',
    '1',
  ];
  writeFileSync(`${base}.cfg`, cfg.join('\r\n') + '\r\n');
  const recordBytes = 8 + 2 * CHANNELS + 2;
  const out = createWriteStream(`${base}.dat`);
  const block = 1 << 16;
  for (let start = 0; start < rows; start += block) {
    const n = Math.min(block, rows - start);
    const buf = Buffer.alloc(n * recordBytes);
    for (let k = 0; k < n; k++) {
      const i = start + k;
      const p = k * recordBytes;
      buf.writeUInt32LE(i + 1, p);
      buf.writeUInt32LE(i * 100, p + 4);
      const w = (2 * Math.PI * 50 * i) / 10_000;
      for (let c = 0; c < CHANNELS; c++) {
        const phase = ((c % 3) * 2 * Math.PI) / 3;
        const v = 30000 * Math.sin(w - phase) + 600 * Math.sin(5 * (w - phase)) + ((i * 7919 + c) % 13);
        buf.writeInt16LE(Math.round(c === 6 || c === 7 ? v / 20 : v), p + 8 + 2 * c);
      }
      buf.writeUInt16LE(i > rows / 2 ? 0b0101 : 0, p + 8 + 2 * CHANNELS);
    }
    if (!out.write(buf)) await new Promise<void>((r) => out.once('drain', () => r()));
  }
  await new Promise<void>((r) => out.end(r));
  return rows * recordBytes;
}

/** numpy: read the .dat with fromfile, scale each channel, and compute the same kind of figures and FFT as the CSV reference. */
export const numpyComtradeScript = `
import time, numpy as np, sys
t = time.perf_counter()
rec = np.dtype([('n', '<u4'), ('t', '<u4'), ('a', '<i2', (${CHANNELS},)), ('d', '<u2')])
d = np.fromfile(sys.argv[1], dtype=rec)
for c in range(${CHANNELS}):
    x = d['a'][:, c] * 0.01
    m = x.mean(); r = np.sqrt((x * x).mean()); a = np.abs(x).mean(); p = np.abs(x).max(); s = np.fft.rfft(x)
print(time.perf_counter() - t)
`;
