/**
 * A COMTRADE writer for tests: lays out a record as DOMAIN.md §8e describes (IEEE C37.111-1999 clauses
 * 6 and 7, 2013 for the .cff; clause numbers from memory), so tests can build any record and read it back.
 */
import type { DataFileType } from '../../shared/comtrade';

export interface TestAnalog {
  id: string;
  phase?: string;
  circuit?: string;
  unit: string;
  a: number;
  b: number;
  skew?: number;
  min?: number;
  max?: number;
  primary?: number;
  secondary?: number;
  ps?: 'P' | 'S';
}

export interface TestRecord {
  rev?: 1999 | 2013;
  station?: string;
  device?: string;
  analog: TestAnalog[];
  digital?: { id: string; normal?: 0 | 1 }[];
  lf?: number;
  /** samp,endsamp lines; empty for nrates 0 (then `0,endsamp` is written). */
  rates: [number, number][];
  start?: string;
  trigger?: string;
  ft: DataFileType;
  timemult?: number;
  /** Raw analog values per record; null writes the missing-value marker of the file type. */
  raw: (number | null)[][];
  /** Digital states per record. */
  states?: (0 | 1)[][];
  /** Time stamps per record in timemult µs; null writes the missing time stamp. */
  timestamps?: (number | null)[];
}

export function cfgText(r: TestRecord): string {
  const digital = r.digital ?? [];
  const lines = [
    `${r.station ?? 'Test station'},${r.device ?? 'Test device'},${r.rev ?? 1999}`,
    `${r.analog.length + digital.length},${r.analog.length}A,${digital.length}D`,
    ...r.analog.map((a, i) => [i + 1, a.id, a.phase ?? '', a.circuit ?? '', a.unit, a.a, a.b, a.skew ?? 0, a.min ?? -32767, a.max ?? 32767, a.primary ?? 1, a.secondary ?? 1, a.ps ?? 'P'].join(',')),
    ...digital.map((d, i) => [i + 1, d.id, '', '', d.normal ?? 0].join(',')),
    String(r.lf ?? 50),
    String(r.rates.length),
    ...(r.rates.length ? r.rates.map(([hz, end]) => `${hz},${end}`) : [`0,${r.raw.length}`]),
    r.start ?? '01/01/2025,00:00:00.000000',
    r.trigger ?? '01/01/2025,00:00:00.000000',
    r.ft,
    String(r.timemult ?? 1),
  ];
  if ((r.rev ?? 1999) === 2013) lines.push('0,0', 'F,0');
  return lines.join('\r\n') + '\r\n';
}

const timestampOf = (r: TestRecord, i: number) => (r.timestamps ? r.timestamps[i] : Math.round((i * 1e6) / (r.timemult ?? 1) / (r.rates[0]?.[0] || 1)));

export function datBytes(r: TestRecord): Uint8Array {
  const digital = r.digital?.length ?? 0;
  if (r.ft === 'ASCII') {
    const lines = r.raw.map((values, i) => {
      const ts = timestampOf(r, i);
      return [i + 1, ts ?? '', ...values.map((v) => (v === null ? 99999 : v)), ...(r.states?.[i] ?? new Array(digital).fill(0))].join(',');
    });
    return new TextEncoder().encode(lines.join('\r\n') + '\r\n');
  }
  const width = r.ft === 'BINARY' ? 2 : 4;
  const words = Math.ceil(digital / 16);
  const size = 8 + width * r.analog.length + 2 * words;
  const out = new Uint8Array(size * r.raw.length);
  const dv = new DataView(out.buffer);
  r.raw.forEach((values, i) => {
    let p = i * size;
    dv.setUint32(p, i + 1, true);
    dv.setUint32(p + 4, timestampOf(r, i) ?? 0xffffffff, true);
    p += 8;
    for (const v of values) {
      if (r.ft === 'BINARY') dv.setInt16(p, v ?? -0x8000, true);
      else if (r.ft === 'BINARY32') dv.setInt32(p, v ?? -0x80000000, true);
      else dv.setFloat32(p, v ?? NaN, true);
      p += width;
    }
    for (let w = 0; w < words; w++, p += 2) {
      let word = 0;
      for (let b = 0; b < 16 && w * 16 + b < digital; b++) word |= (r.states?.[i][w * 16 + b] ?? 0) << b;
      dv.setUint16(p, word, true);
    }
  });
  return out;
}

/** The 2013 combined file: section lines, the configuration, then the data (binary with its byte count). */
export function cffBytes(r: TestRecord): Uint8Array {
  const dat = datBytes(r);
  const dataLine = r.ft === 'ASCII' ? '--- file type: DAT ASCII ---' : `--- file type: DAT BINARY: ${dat.length} ---`;
  const head = new TextEncoder().encode(`--- file type: CFG ---\r\n${cfgText({ ...r, rev: 2013 })}--- file type: INF ---\r\n--- file type: HDR ---\r\nWritten by a test.\r\n${dataLine}\r\n`);
  const out = new Uint8Array(head.length + dat.length);
  out.set(head);
  out.set(dat, head.length);
  return out;
}
