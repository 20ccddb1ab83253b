/**
 * Records Crestline refuses, each with the file and the line (text) or byte offset (binary) in the
 * message. Built from the hand-written records and the test writer (layout per DOMAIN.md §8e).
 */
import { describe, expect, it } from 'vitest';
import { ComtradeError, readCff, readComtrade } from '../../../shared/comtrade';
import { cfgText, datBytes, type TestRecord } from '../../helpers/comtradeWriter';
import { EASTFIELD_CFG, EASTFIELD_DAT } from './handRecords';

const bytes = (s: string) => new TextEncoder().encode(s);

function refusal(cfg: string | Uint8Array, dat: Uint8Array, limits = {}): ComtradeError {
  try {
    readComtrade(typeof cfg === 'string' ? bytes(cfg) : cfg, [dat], dat.length, { configName: 'bay4.cfg', dataName: 'bay4.dat', limits });
  } catch (e) {
    expect(e).toBeInstanceOf(ComtradeError);
    expect((e as Error).message.length).toBeLessThanOrEqual(500);
    return e as ComtradeError;
  }
  throw new Error('the record was read, not refused');
}

const sine = (ft: TestRecord['ft'], n = 40): TestRecord => ({
  analog: [{ id: 'VA', unit: 'V', a: 0.1, b: 0 }],
  digital: [{ id: 'TRIP' }],
  rates: [[4000, n]],
  ft,
  raw: Array.from({ length: n }, (_, i) => [Math.round(3000 * Math.sin((2 * Math.PI * 50 * i) / 4000))]),
  states: Array.from({ length: n }, () => [0]),
});

describe('refused configurations', () => {
  it('no revision year (a 1991 record)', () => {
    const e = refusal(EASTFIELD_CFG.replace(',1999', ''), bytes(EASTFIELD_DAT));
    expect(e.message).toMatch(/^bay4\.cfg, line 1: .*no revision year .*1991/);
  });

  it('an unknown data file type names its line', () => {
    expect(refusal(EASTFIELD_CFG.replace('ASCII', 'BINARY16'), bytes(EASTFIELD_DAT)).message).toMatch(/^bay4\.cfg, line 11: unknown data file type "BINARY16"/);
  });

  it('a total that is not analog + digital', () => {
    expect(refusal(EASTFIELD_CFG.replace('3,2A,1D', '4,2A,1D'), bytes(EASTFIELD_DAT)).message).toMatch(/line 2: the total channel count 4 is not 2 analog \+ 1 digital/);
  });

  it('more analog channels declared than described: the digital line is not an analog one', () => {
    const e = refusal(EASTFIELD_CFG.replace('3,2A,1D', '4,3A,1D'), bytes(EASTFIELD_DAT));
    expect(e.message).toMatch(/line 5: expected analog channel 3 of 3 \(13 comma-separated fields\) but found 5 fields\. Line 2 declares 3 analog channels/);
    expect(e.line).toBe(5);
  });

  it('fewer digital channels declared than described', () => {
    const cfg = EASTFIELD_CFG.replace('3,2A,1D', '3,2A,1D').replace('1,TRIP,,Line 4 breaker,0', '1,TRIP,,Line 4 breaker,0\r\n2,CLOSE,,Line 4 breaker,0');
    expect(refusal(cfg, bytes(EASTFIELD_DAT)).message).toMatch(/line 6: expected the line frequency .* Line 2 declares 1 digital channel:/);
  });

  it('more channels than the limit, before anything is sized by them', () => {
    expect(refusal(EASTFIELD_CFG.replace('3,2A,1D', '100001,100000A,1D'), bytes(EASTFIELD_DAT)).message).toMatch(/line 2: 100000 analog channels: Crestline reads at most 64/);
  });

  it('a sample count beyond the sample budget, before the columns are allocated', () => {
    const e = refusal(EASTFIELD_CFG.replace('1000,6', '1000,9999999999'), bytes(EASTFIELD_DAT));
    expect(e.message).toMatch(/line 8: 9,999,999,999 samples × 2 analog channels is more than/);
  });

  it('a date in another layout', () => {
    expect(refusal(EASTFIELD_CFG.replace('05/03/2024,14:22:31.250000', '2024-03-05,14:22:31.25'), bytes(EASTFIELD_DAT)).message).toMatch(/line 9: the date and time of the first sample must be written dd\/mm\/yyyy/);
  });

  it('a line longer than the line bound', () => {
    expect(refusal(EASTFIELD_CFG.replace('Bay 4 relay', 'x'.repeat(70_000)), bytes(EASTFIELD_DAT)).message).toMatch(/line 1: the line is longer than 65,536 characters/);
    expect(refusal(EASTFIELD_CFG.replace('Bay 4 relay', 'x'.repeat(2_000)), bytes(EASTFIELD_DAT), { maxLineChars: 1000 }).message).toMatch(/line 1: the line is longer than 1,000 characters/);
  });

  it('a .dat given in place of the .cfg', () => {
    expect(refusal(datBytes(sine('BINARY')), datBytes(sine('BINARY'))).message).toMatch(/not text .*is it the \.dat\?/);
  });

  it('a long file name is shortened in the message', () => {
    try {
      readComtrade(bytes('x'), [new Uint8Array()], 0, { configName: `${'very-long-name-'.repeat(20)}.cfg` });
    } catch (e) {
      expect((e as Error).message).toMatch(/^very-long-name-.{10,40}….{10,40}name-\.cfg, line 1:/);
    }
  });
});

describe('refused ASCII data', () => {
  it('a record with a value too many names its line and the counts', () => {
    const e = refusal(EASTFIELD_CFG, bytes(EASTFIELD_DAT.replace('4,3000,22,,1', '4,3000,22,,1,0')));
    expect(e.message).toMatch(/^bay4\.dat, line 4: expected 5 values \(sample number, time stamp, 2 analog, 1 digital, as the \.cfg declares on line 2\) but found 6/);
  });

  it('a short record', () => {
    expect(refusal(EASTFIELD_CFG, bytes(EASTFIELD_DAT.replace('5,4000,0,0,1', '5,4000,0,0'))).message).toMatch(/bay4\.dat, line 5: expected 5 values .* but found 4/);
  });

  it('a value that is not a number', () => {
    expect(refusal(EASTFIELD_CFG, bytes(EASTFIELD_DAT.replace('5,4000,0,0,1', '5,4000,0,x1,1'))).message).toMatch(/bay4\.dat, line 5: analog value 2 \(field 4\) is not a number/);
  });

  it('fewer records than the .cfg declares', () => {
    expect(refusal(EASTFIELD_CFG.replace('1000,6', '1000,7'), bytes(EASTFIELD_DAT)).message).toMatch(/bay4\.dat, line \d+: the data ends after 6 records; the \.cfg declares 7/);
  });

  it('more records than the .cfg declares', () => {
    expect(refusal(EASTFIELD_CFG.replace('1000,6', '1000,5'), bytes(EASTFIELD_DAT)).message).toMatch(/bay4\.dat, line 6: more records than the \.cfg declares \(5/);
  });

  it('a digital value other than 0 or 1', () => {
    expect(refusal(EASTFIELD_CFG, bytes(EASTFIELD_DAT.replace('5,4000,0,0,1', '5,4000,0,0,2'))).message).toMatch(/line 5: digital value 1 \(field 5\) must be 0 or 1/);
  });
});

describe('refused binary data', () => {
  for (const ft of ['BINARY', 'BINARY32', 'FLOAT32'] as const) {
    it(`${ft}: a short .dat names the offset of the cut record`, () => {
      const r = sine(ft);
      const dat = datBytes(r);
      const size = dat.length / 40;
      const e = refusal(cfgText(r), dat.subarray(0, dat.length - 3));
      expect(e.message).toMatch(new RegExp(`^bay4\\.dat, byte ${(39 * size).toLocaleString('en-US')}: .* record 40 is cut short`));
      expect(e.offset).toBe(39 * size);
    });
  }

  it('a .dat of another record: whole records, but more of them', () => {
    const r = sine('BINARY');
    expect(refusal(cfgText({ ...r, rates: [[4000, 30]] }), datBytes(r)).message).toMatch(/bay4\.dat, byte 360: .* it holds 40 records\. Does the \.dat belong to this \.cfg\?/);
  });

  it('a combined file whose data section says ASCII for a binary configuration', () => {
    const r = sine('BINARY');
    const text = `--- file type: CFG ---\r\n${cfgText({ ...r, rev: 2013 })}--- file type: DAT ASCII ---\r\n`;
    const cff = new Uint8Array([...bytes(text), ...datBytes(r)]);
    expect(() => readCff([cff], cff.length, { configName: 'bay4.cff' })).toThrow(/bay4\.cff, line 15: the data section is marked ASCII but the configuration's data file type is BINARY/);
  });

  it('a combined file without a data section', () => {
    const cff = bytes(`--- file type: CFG ---\r\n${cfgText(sine('ASCII'))}`);
    expect(() => readCff([cff], cff.length, { configName: 'bay4.cff' })).toThrow(/bay4\.cff, line \d+: the file ends before a "--- file type: DAT ASCII ---"/);
  });

  it('bytes after the declared binary section', () => {
    const r = sine('BINARY');
    const dat = datBytes(r);
    const cff = new Uint8Array([...bytes(`--- file type: CFG ---\r\n${cfgText({ ...r, rev: 2013 })}--- file type: DAT BINARY: ${dat.length} ---\r\n`), ...dat, 1, 2, 3]);
    expect(() => readCff([cff], cff.length, { configName: 'bay4.cff' })).toThrow(/bay4\.cff, byte [\d,]+: data follows the end of the binary data section/);
  });
});

describe('refused time bases', () => {
  it('several different rates: the samples are not steady, refused at the record where the rate changes', () => {
    const r: TestRecord = { ...sine('ASCII'), rates: [[4000, 30], [1000, 40]], timestamps: Array.from({ length: 40 }, (_, i) => (i < 30 ? i * 250 : 7250 + (i - 29) * 1000)) };
    const e = refusal(cfgText(r), datBytes(r));
    expect(e.message).toMatch(/^bay4\.dat, line 31: Sampling is irregular: the time steps by 4\.00 sample intervals .* The \.cfg gives 2 sample rates/);
  });

  it('several equal rates are one steady rate', () => {
    const r: TestRecord = { ...sine('BINARY'), rates: [[4000, 20], [4000, 40]] };
    expect(readComtrade(bytes(cfgText(r)), [datBytes(r)], datBytes(r).length, { configName: 'x.cfg' }).timeBase).toMatchObject({ sampleRate: 4000, source: 'rate' });
  });

  it('nrates 0 and a missing time stamp (0xFFFFFFFF): nothing gives its time', () => {
    const r: TestRecord = { ...sine('BINARY'), rates: [], timestamps: Array.from({ length: 40 }, (_, i) => (i === 7 ? null : i * 250)) };
    const dat = datBytes(r);
    expect(refusal(cfgText(r), dat).message).toMatch(new RegExp(`^bay4\\.dat, byte ${7 * (dat.length / 40)}: this record has no time stamp \\(1 in all\\)`));
  });

  it('nrates 0 with a gap in the time stamps', () => {
    const r: TestRecord = { ...sine('ASCII'), rates: [], timestamps: Array.from({ length: 40 }, (_, i) => i * 250 + (i >= 30 ? 2000 : 0)) };
    expect(refusal(cfgText(r), datBytes(r)).message).toMatch(/^bay4\.dat, line 31: Sampling is irregular/);
  });

  it('several rates with missing time stamps fall back on the times the rates give (and are refused as irregular)', () => {
    const r: TestRecord = { ...sine('BINARY'), rates: [[4000, 20], [2000, 40]], timestamps: new Array(40).fill(null) };
    expect(refusal(cfgText(r), datBytes(r)).message).toMatch(/Sampling is irregular/);
  });
});
