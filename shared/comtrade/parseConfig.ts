import { CfgCursor } from './CfgCursor';
import { readAnalogChannels, readDigitalChannels } from './cfgChannels';
import { comtradeTimestamp } from './cfgValues';
import type { ComtradeConfig, ComtradeTimestamp, DataFileType, SampleRateConfig } from './ComtradeConfig';
import type { ComtradeLimits } from './comtradeLimits';

const FILE_TYPES: DataFileType[] = ['ASCII', 'BINARY', 'BINARY32', 'FLOAT32'];
/** endsamp has at most ten digits (from memory); a bound that also keeps counts exact in a double. */
const MAX_SAMPLE_NUMBER = 9_999_999_999;

/** A `##A`/`##D` count of line 2: digits followed by the letter. */
function channelCount(cfg: CfgCursor, field: string, letter: 'A' | 'D', line: number, max: number): number {
  const t = field.trim().toUpperCase();
  const n = t.endsWith(letter) ? Number(t.slice(0, -1)) : NaN;
  if (!Number.isInteger(n) || n < 0 || t.length < 2) throw cfg.error(line, `expected the ${letter === 'A' ? 'analog' : 'digital'} channel count as a number followed by ${letter} (e.g. 4${letter}); found "${field.trim().slice(0, 20)}".`);
  if (n > max) throw cfg.error(line, `${n} ${letter === 'A' ? 'analog' : 'digital'} channels: Crestline reads at most ${max}.`);
  return n;
}

function timestamp(cfg: CfgCursor, what: string): { value: ComtradeTimestamp | null; line: number } {
  const l = cfg.expect(what, 2);
  if (l.fields.every((f) => f.trim() === '')) return { value: null, line: l.line };
  const value = comtradeTimestamp(l.fields[0], l.fields[1]);
  if (!value) throw cfg.error(l.line, `${what} must be written dd/mm/yyyy,hh:mm:ss.ssssss; found "${l.fields.join(',').trim().slice(0, 60)}".`);
  return { value, line: l.line };
}

/**
 * Reads a COMTRADE configuration of the 1999 or 2013 edition (IEEE C37.111 / IEC 60255-24). Every
 * count is checked against `limits` before anything is sized by it. Throws a ComtradeError naming
 * the file and line.
 *
 * @param text the .cfg text (or the CFG section of a .cff)
 * @param firstLine the file line of the text's first line (1 for a .cfg)
 */
export function parseConfig(text: string, file: string, limits: ComtradeLimits, firstLine = 1): ComtradeConfig {
  const cfg = new CfgCursor(text, firstLine, file, limits);
  // Line 1: station_name,rec_dev_id,rev_year (clause 6.4.1, from memory). 1991 files have no rev_year.
  const head = cfg.expect('the station line (station_name,rec_dev_id,rev_year)', 2, 3);
  const rev = cfg.text(head, 2);
  if (rev !== '1999' && rev !== '2013') {
    const why = rev === '' ? 'names no revision year (an IEEE C37.111-1991 record?)' : `names the revision year "${rev.slice(0, 20)}"`;
    throw cfg.error(head.line, `the configuration ${why}; Crestline reads the 1999 and 2013 editions.`);
  }
  // Line 2: TT,##A,##D (clause 6.4.2, from memory).
  const counts = cfg.expect('the channel counts (TT,##A,##D)', 3);
  const total = cfg.integer(counts, 0, 'the total channel count TT', 0, 999_999);
  const analogCount = channelCount(cfg, counts.fields[1], 'A', counts.line, limits.maxChannels);
  const digitalCount = channelCount(cfg, counts.fields[2], 'D', counts.line, limits.maxDigitalChannels);
  if (total !== analogCount + digitalCount) throw cfg.error(counts.line, `the total channel count ${total} is not ${analogCount} analog + ${digitalCount} digital.`);
  if (analogCount === 0) throw cfg.error(counts.line, 'the record has no analog channel, so there is nothing to analyse.');
  const analog = readAnalogChannels(cfg, analogCount, counts.line);
  const digital = readDigitalChannels(cfg, digitalCount, counts.line);
  // lf (clause 6.4.5, from memory): may be empty.
  const lf = cfg.expect('the line frequency', 1, 1, `Line ${counts.line} declares ${digitalCount} digital channel${digitalCount === 1 ? '' : 's'}: does that match the channel lines?`);
  const lineFrequencyHz = cfg.number(lf, 0, 'the line frequency', NaN);
  // nrates, then nrates lines samp,endsamp; with nrates 0 one line 0,endsamp (clause 6.4.6, from memory).
  const nratesLine = cfg.expect('the number of sample rates (nrates)', 1);
  const nrates = cfg.integer(nratesLine, 0, 'nrates', 0, limits.maxRates);
  const rates: SampleRateConfig[] = [];
  let sampleCount = 0;
  for (let r = 0; r < Math.max(nrates, 1); r++) {
    const l = cfg.expect(nrates === 0 ? 'the line 0,endsamp that follows nrates 0' : `sample rate ${r + 1} of ${nrates} (samp,endsamp)`, 2);
    const hz = cfg.number(l, 0, 'the sample rate samp');
    const endSample = cfg.integer(l, 1, 'the last sample number endsamp', sampleCount + 1, MAX_SAMPLE_NUMBER);
    if (!(hz >= 0) || !Number.isFinite(hz)) throw cfg.error(l.line, `the sample rate must not be negative; it is ${hz}.`);
    sampleCount = endSample;
    if (nrates > 0) rates.push({ hz, endSample, line: l.line });
  }
  if (sampleCount * analogCount > limits.maxSamples) {
    throw cfg.error(nratesLine.line + Math.max(nrates, 1), `${sampleCount.toLocaleString('en-US')} samples × ${analogCount} analog channels is more than the ${limits.maxSamples.toLocaleString('en-US')} samples Crestline reads from one record.`);
  }
  const start = timestamp(cfg, 'the date and time of the first sample');
  const trigger = timestamp(cfg, 'the date and time of the trigger');
  // ft (clause 6.4.8, from memory).
  const ftLine = cfg.expect('the data file type (ASCII, BINARY, BINARY32 or FLOAT32)', 1);
  const ft = cfg.text(ftLine, 0).toUpperCase() as DataFileType;
  if (!FILE_TYPES.includes(ft)) throw cfg.error(ftLine.line, `unknown data file type "${cfg.text(ftLine, 0).slice(0, 20)}": expected ASCII, BINARY, BINARY32 or FLOAT32.`);
  // timemult (clause 6.4.9, from memory); some writers leave it out, which means 1.
  const tm = cfg.take();
  const timeMultiplier = tm ? cfg.number(tm, 0, 'the time multiplier') : 1;
  if (!(timeMultiplier > 0) || !Number.isFinite(timeMultiplier)) throw cfg.error(tm!.line, `the time multiplier must be above 0; it is ${timeMultiplier}.`);
  // 2013: time_code,local_code then tmq_code,leapsec (from memory); optional here.
  const tc = rev === '2013' ? cfg.take() : null;
  const tq = tc ? cfg.take() : null;
  return {
    station: cfg.text(head, 0),
    device: cfg.text(head, 1),
    revYear: rev === '2013' ? 2013 : 1999,
    analog,
    digital,
    lineFrequencyHz: Number.isNaN(lineFrequencyHz) ? null : lineFrequencyHz,
    rates,
    sampleCount,
    start: start.value,
    trigger: trigger.value,
    fileType: ft,
    timeMultiplier,
    timeCode: tc ? cfg.text(tc, 0) : null,
    localCode: tc ? cfg.text(tc, 1) : null,
    timeQuality: tq ? cfg.text(tq, 0) : null,
    leapSecond: tq ? cfg.text(tq, 1) : null,
    lines: { station: head.line, counts: counts.line, frequency: lf.line, rates: nratesLine.line, start: start.line, trigger: trigger.line, fileType: ftLine.line, timeMultiplier: tm?.line ?? null, timeCode: tc?.line ?? null, timeQuality: tq?.line ?? null },
  };
}
