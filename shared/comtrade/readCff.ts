import { binaryRecordBytes } from './BinaryDatReader';
import { CffSections } from './CffSections';
import { ComtradeError } from './ComtradeError';
import type { ComtradeRecord } from './ComtradeRecord';
import { comtradeLimits } from './comtradeLimits';
import { needsTimestamps } from './comtradeTimeBase';
import { parseConfig } from './parseConfig';
import { configText, dataReader, finishRecord, type ComtradeReadOptions } from './readComtrade';
import { RecordColumns } from './RecordColumns';

/** Whether bytes are only line breaks, spaces and tabs (what a writer may leave after a binary section). */
const onlySpace = (b: Uint8Array) => b.every((c) => c === 10 || c === 13 || c === 32 || c === 9);

/**
 * Reads a 2013 combined file (.cff): its CFG section as a .cfg, its DAT section as the .dat (the INF
 * and HDR sections are passed over). Errors name the .cff with its own lines and byte offsets.
 *
 * @param totalBytes size of the whole .cff in bytes
 */
export function readCff(chunks: Iterable<Uint8Array>, totalBytes: number, options: ComtradeReadOptions): ComtradeRecord {
  const limits = comtradeLimits(options.limits);
  const values = options.values ?? 'primary';
  const file = options.configName;
  // The text sections may hold a long header (HDR) besides the configuration.
  const sections = new CffSections(file, 4 * limits.maxHeadBytes);
  const iterator = chunks[Symbol.iterator]();
  let found: ReturnType<CffSections['push']> = null;
  while (!found) {
    const next = iterator.next();
    if (next.done) throw sections.ended();
    found = sections.push(next.value);
  }
  const { head, rest } = found;
  const text = configText(new TextEncoder().encode(head.cfgText), file, limits);
  const cfg = parseConfig(text, file, limits, head.cfgFirstLine);
  const binary = cfg.fileType !== 'ASCII';
  if (binary !== (head.data.kind === 'BINARY')) {
    throw new ComtradeError({ file, line: head.dataLine - 1 }, `the data section is marked ${head.data.kind} but the configuration's data file type is ${cfg.fileType} (line ${cfg.lines.fileType}).`);
  }
  const available = totalBytes - head.dataOffset;
  // Without a declared count, a binary section runs to the end of the file, less any blank space after it.
  const wanted = binary ? cfg.sampleCount * binaryRecordBytes(cfg.fileType as 'BINARY', cfg.analog.length, cfg.digital.length) : available;
  const dataBytes = head.data.kind === 'BINARY' && head.data.bytes !== null ? head.data.bytes : Math.min(available, wanted);
  const cols = new RecordColumns(cfg, values, needsTimestamps(cfg), limits.maxDigitalChanges);
  const { reader, placeOf } = dataReader(cols, file, limits, dataBytes, { line: head.dataLine, offset: head.dataOffset });
  // A binary section is exactly its declared bytes; only blank space may follow it.
  let left = binary ? dataBytes : Infinity;
  const feed = (chunk: Uint8Array, at: number) => {
    const take = Math.min(left, chunk.length);
    if (take > 0) reader.push(take === chunk.length ? chunk : chunk.subarray(0, take));
    left -= take;
    const after = chunk.subarray(take);
    if (after.length > 0 && !onlySpace(after)) throw new ComtradeError({ file, offset: at + take }, 'data follows the end of the binary data section.');
  };
  let at = head.dataOffset;
  feed(rest, at);
  at += rest.length;
  for (let next = iterator.next(); !next.done; next = iterator.next()) {
    feed(next.value, at);
    at += next.value.length;
  }
  reader.finish();
  return finishRecord(cols, values, placeOf, text, true);
}
