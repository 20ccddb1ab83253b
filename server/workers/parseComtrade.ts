import { closeSync, fstatSync, openSync, readSync, statSync } from 'node:fs';
import { ComtradeError, comtradeSummary, DEFAULT_COMTRADE_LIMITS, describeRecord, readCff, readComtrade, type ComtradeRecord } from '../../shared/comtrade';
import type { ComtradeSummary } from '../../shared/schemas/comtrade';
import type { IngestRequest, ParsedFile } from './ingestTask';

/** The COMTRADE side of an ingest request. */
export interface ComtradeFiles {
  /** The .dat beside a .cfg; null for a combined .cff. */
  dataFile: string | null;
  configName: string;
  dataName: string | null;
  values: 'primary' | 'secondary';
}

/** A mark a file itself sets on its capture (the trigger of a COMTRADE record), stored as a suggestion. */
export interface FileMark {
  startS: number;
  endS: number;
  label: string;
  severity: 'info';
  reason: string;
}

/** What a COMTRADE record adds to a parsed file; a CSV has neither. */
export interface FileExtras {
  comtrade?: ComtradeSummary;
  marks?: FileMark[];
}

/** The first `max` bytes of a file, and whether it holds more: a .cfg is read whole only when small. */
function head(path: string, max: number): Uint8Array {
  const fd = openSync(path, 'r');
  try {
    const size = Math.min(fstatSync(fd).size, max);
    const buf = Buffer.alloc(size);
    let got = 0;
    while (got < size) {
      const n = readSync(fd, buf, got, size - got, got);
      if (n === 0) break;
      got += n;
    }
    return buf.subarray(0, got);
  } finally {
    closeSync(fd);
  }
}

/** Reads a COMTRADE record (a .cfg with its .dat, or a .cff) into the same shape as a CSV capture, before channel setups and three-phase systems. */
export function parseComtrade(req: IngestRequest, files: ComtradeFiles, chunks: (path: string) => Iterable<Uint8Array>): Omit<ParsedFile, 'systems'> {
  const t = performance.now();
  // The .dat of a pair was kept with it; gone now, it is named rather than taken for a .cff.
  if (files.dataName && !files.dataFile) throw new ComtradeError({ file: files.dataName }, 'the data file of this record is missing.');
  const options = { configName: files.configName, dataName: files.dataName ?? undefined, values: files.values, limits: req.limits };
  // One byte over the bound is enough for the reader to refuse an oversized .cfg without reading it all.
  const record: ComtradeRecord = files.dataFile
    ? readComtrade(head(req.file, (req.limits?.maxHeadBytes ?? DEFAULT_COMTRADE_LIMITS.maxHeadBytes) + 1), chunks(files.dataFile), statSync(files.dataFile).size, options)
    : readCff(chunks(req.file), statSync(req.file).size, options);
  if (process.env.CRESTLINE_TRACE) console.log(`  reading COMTRADE ${(performance.now() - t).toFixed(0)} ms`);
  const tb = record.timeBase;
  const cfg = record.config;
  return {
    sampleRate: tb.sampleRate,
    sampleCount: cfg.sampleCount,
    t0: tb.t0,
    detected: {
      encoding: 'utf-8',
      bom: false,
      lineEnding: record.lineEnding,
      delimiter: ',',
      decimal: '.',
      headerLine: null,
      unitsLine: null,
      dataStartLine: 1,
      timeColumn: tb.source === 'timestamps' ? `time stamp (${cfg.timeMultiplier} µs)` : null,
      timeSource: tb.source === 'timestamps' ? 'column' : 'preamble',
      timeDeviationSamples: tb.deviation,
      rows: cfg.sampleCount,
    },
    metadata: describeRecord(record),
    channels: record.channels.map((c) => ({ name: c.name, unit: c.unit, invalidCount: c.invalidCount, firstInvalidLine: c.firstInvalidLine, samples: c.samples })),
    comtrade: comtradeSummary(record),
    marks:
      tb.triggerS === null
        ? []
        : [{ startS: tb.triggerS, endS: tb.triggerS, label: 'Trigger', severity: 'info', reason: `The record's trigger time, ${cfg.trigger?.text} (line ${cfg.lines.trigger} of ${files.configName.slice(0, 80)}); the time axis counts from it.` }],
  };
}
