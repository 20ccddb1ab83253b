/**
 * The CSV writer against csv-parse (the reader Crestline already depends on): what is written reads back
 * as written, in both dialects. The formula characters are OWASP's list for CSV injection (common practice).
 */
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { csvDialect, csvDocument, csvNumber, csvText } from '../../../server/exports/csvWriter';

const point = csvDialect({ decimal: 'point' });
const comma = csvDialect({ decimal: 'comma' });

describe('csvText', () => {
  it.each(['=1+1', '+41 79', '-cmd', '@SUM(A1)', '\tx', '\rx'])('neutralises %j with a leading apostrophe', (s) => {
    expect(csvText(s, point).replace(/^"|"$/g, '')).toBe(`'${s}`);
  });
  it('leaves ordinary text alone and quotes what holds the delimiter, quotes or line breaks', () => {
    expect(csvText('True RMS (AC+DC)', point)).toBe('True RMS (AC+DC)');
    expect(csvText('a,b', point)).toBe('"a,b"');
    expect(csvText('a,b', comma)).toBe('a,b');
    expect(csvText('a;b', comma)).toBe('"a;b"');
    expect(csvText('say "hi"', point)).toBe('"say ""hi"""');
  });
});

describe('csvNumber', () => {
  it('writes numbers as numbers: negative ones are not neutralised', () => {
    expect(csvNumber(-1.5, point)).toBe('-1.5');
    expect(csvNumber(-1.5, comma)).toBe('-1,5');
    expect(csvNumber(230.000000000004, point)).toBe('230');
    expect(csvNumber(null, point)).toBe('');
    expect(csvNumber(NaN, point)).toBe('');
  });
});

describe('csvDocument', () => {
  const header = ['Quantity', '=HYPERLINK("x") (V)'];
  const rows = [['True RMS (AC+DC)', 230.25], ['DC mean', -0.0015], ['@note', null]] as const;

  it('round-trips through csv-parse with a decimal point', () => {
    const text = csvDocument(header, rows.map((r) => [...r]), point);
    expect(text.charCodeAt(0)).not.toBe(0xfeff);
    const back = parse(text) as string[][];
    expect(back[0]).toEqual(['Quantity', `'=HYPERLINK("x") (V)`]);
    expect(back.slice(1)).toEqual([['True RMS (AC+DC)', '230.25'], ['DC mean', '-0.0015'], ["'@note", '']]);
  });

  it('round-trips with a decimal comma: semicolons, a UTF-8 BOM, and numbers that read back', () => {
    const text = csvDocument(header, rows.map((r) => [...r]), comma);
    expect(text.startsWith('\uFEFF')).toBe(true);
    const back = parse(text, { delimiter: ';', bom: true }) as string[][];
    expect(back[1]).toEqual(['True RMS (AC+DC)', '230,25']);
    expect(Number(back[2][1].replace(',', '.'))).toBe(-0.0015);
  });

  it('leaves the BOM out when asked', () => {
    expect(csvDocument(header, [], csvDialect({ decimal: 'comma', bom: false })).startsWith('\uFEFF')).toBe(false);
  });
});
