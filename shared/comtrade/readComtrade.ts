import { AsciiDatReader } from './AsciiDatReader';
import { BinaryDatReader } from './BinaryDatReader';
import type { ValuesSide } from './channelScaling';
import { ComtradeError, type ComtradePlace } from './ComtradeError';
import type { ComtradeRecord } from './ComtradeRecord';
import { comtradeLimits, type ComtradeLimits } from './comtradeLimits';
import { comtradeTimeBase, needsTimestamps } from './comtradeTimeBase';
import { parseConfig } from './parseConfig';
import { RecordColumns } from './RecordColumns';

export interface ComtradeReadOptions {
  /** File names as uploaded, for messages: the .cfg (or .cff) and the .dat. */
  configName: string;
  dataName?: string;
  /** Values on the primary (default) or secondary side of the instrument transformers. */
  values?: ValuesSide;
  limits?: Partial<ComtradeLimits>;
}

/** Decodes .cfg bytes as UTF-8 (the 2013 edition's encoding, from memory; plain ASCII for 1999), after the size and text checks. */
export function configText(bytes: Uint8Array, file: string, limits: ComtradeLimits): string {
  if (bytes.length > limits.maxHeadBytes) throw new ComtradeError({ file }, `the configuration is ${bytes.length.toLocaleString('en-US')} bytes; Crestline reads at most ${limits.maxHeadBytes.toLocaleString('en-US')}.`);
  const nul = bytes.indexOf(0);
  if (nul >= 0) throw new ComtradeError({ file, offset: nul }, 'the configuration is not text (it holds a zero byte): is it the .dat?');
  const bom = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
  return new TextDecoder('utf-8').decode(bytes.subarray(bom));
}

/** The data reader for the .cfg's file type, with the place of a record for later errors. */
export function dataReader(cols: RecordColumns, file: string, limits: ComtradeLimits, dataBytes: number, at: { line: number; offset: number }) {
  if (cols.cfg.fileType === 'ASCII') {
    const r = new AsciiDatReader(cols, file, limits.maxLineChars, at.line);
    return { reader: r, placeOf: (row: number): ComtradePlace => ({ file, line: r.lineOf(row) }) };
  }
  const r = new BinaryDatReader(cols, file, dataBytes, at.offset);
  return { reader: r, placeOf: (row: number): ComtradePlace => ({ file, offset: r.offsetOf(row) }) };
}

/** Turns the filled columns into the record: the time base, channel names, digital state changes. */
export function finishRecord(cols: RecordColumns, values: ValuesSide, placeOf: (row: number) => ComtradePlace, text: string, combined: boolean): ComtradeRecord {
  const cfg = cols.cfg;
  const timeBase = comtradeTimeBase(cols, placeOf);
  const timeOf = (sample: number) => timeBase.t0 + sample / timeBase.sampleRate;
  return {
    config: cfg,
    values,
    timeBase,
    lineEnding: text.includes('\r\n') ? 'CRLF' : 'LF',
    combined,
    channels: cfg.analog.map((ch, i) => ({
      name: ch.id || `A${i + 1}`,
      unit: ch.unit,
      samples: cols.samples[i],
      invalidCount: cols.invalidCount[i],
      firstInvalidLine: cols.firstInvalid[i] !== null ? (placeOf(cols.firstInvalid[i]!).line ?? null) : null,
      scaling: cols.scaling[i],
    })),
    digital: cfg.digital.map((config, i) => ({
      config,
      initialState: cols.digital.initial[i] as 0 | 1,
      changeCount: cols.digital.changeCount[i],
      changes: cols.digital.changes[i].map((c) => ({ sample: c.sample, timeS: timeOf(c.sample), state: c.state })),
    })),
  };
}

/**
 * Reads a COMTRADE record from its .cfg bytes and its .dat pushed as chunks (as the worker streams the
 * file), the 1999 or 2013 edition, in any of the four data file types. Counts in the .cfg are checked
 * against the limits before any array is sized; every refusal is a ComtradeError naming the file and
 * the line (text) or byte offset (binary).
 *
 * @param dataBytes size of the .dat in bytes (a binary .dat must match the .cfg exactly)
 */
export function readComtrade(cfgBytes: Uint8Array, dat: Iterable<Uint8Array>, dataBytes: number, options: ComtradeReadOptions): ComtradeRecord {
  const limits = comtradeLimits(options.limits);
  const values = options.values ?? 'primary';
  const dataName = options.dataName ?? options.configName.replace(/\.cfg$/i, '.dat');
  const text = configText(cfgBytes, options.configName, limits);
  const cfg = parseConfig(text, options.configName, limits);
  const cols = new RecordColumns(cfg, values, needsTimestamps(cfg), limits.maxDigitalChanges);
  const { reader, placeOf } = dataReader(cols, dataName, limits, dataBytes, { line: 1, offset: 0 });
  for (const chunk of dat) reader.push(chunk);
  reader.finish();
  return finishRecord(cols, values, placeOf, text, false);
}
