import { ComtradeError } from './ComtradeError';
import type { RecordColumns } from './RecordColumns';

/** Bytes of one analog value per binary file type (1999 clause 7.3 and the 2013 edition, from memory). */
const VALUE_BYTES = { BINARY: 2, BINARY32: 4, FLOAT32: 4 } as const;
/** The missing-value markers: 0x8000 in int16, 0x80000000 in int32 (DOMAIN.md §8e); a float32 NaN. */
const MISSING_INT16 = -0x8000;
const MISSING_INT32 = -0x80000000;
/** A missing time stamp, 0xFFFFFFFF (from memory). */
const MISSING_TIMESTAMP = 0xffffffff;

/** Bytes of one binary record: sample number and time stamp (uint32 each), the analog values, 16 status bits a word. */
export const binaryRecordBytes = (fileType: keyof typeof VALUE_BYTES, analog: number, digital: number) => 8 + VALUE_BYTES[fileType] * analog + 2 * Math.ceil(digital / 16);

/**
 * Reads binary .dat records (BINARY, BINARY32, FLOAT32; little-endian) pushed as chunks of any size, in
 * one pass through a DataView, into the columns: no allocation per record, only a record-sized carry
 * for a record split across two chunks. The byte count is checked against the .cfg before any record is
 * read, so a short or long file is refused at once with the offset where it parts from the .cfg.
 */
export class BinaryDatReader {
  private readonly recordBytes: number;
  private readonly carry: Uint8Array;
  private carried = 0;
  private readonly previousWords: Uint16Array;

  constructor(
    private readonly cols: RecordColumns,
    private readonly file: string,
    dataBytes: number,
    /** Offset of the data in its file (a .cff's data section starts after its text sections). */
    private readonly baseOffset = 0,
  ) {
    const { cfg } = cols;
    const type = cfg.fileType as keyof typeof VALUE_BYTES;
    this.recordBytes = binaryRecordBytes(type, cfg.analog.length, cfg.digital.length);
    this.carry = new Uint8Array(this.recordBytes);
    this.previousWords = new Uint16Array(Math.ceil(cfg.digital.length / 16));
    const wanted = cfg.sampleCount * this.recordBytes;
    if (dataBytes !== wanted) throw this.sizeError(dataBytes, wanted);
  }

  private sizeError(bytes: number, wanted: number): ComtradeError {
    const R = this.recordBytes;
    const n = this.cols.cfg.sampleCount;
    const what = `${bytes.toLocaleString('en-US')} bytes of data, but the .cfg declares ${n.toLocaleString('en-US')} ${this.cols.cfg.fileType} records of ${R} bytes (${wanted.toLocaleString('en-US')} bytes)`;
    if (bytes < wanted) {
      const whole = Math.floor(bytes / R);
      const where = bytes % R === 0 ? `the data ends after record ${whole}` : `record ${whole + 1} is cut short`;
      return new ComtradeError({ file: this.file, offset: this.baseOffset + whole * R }, `${what}: ${where}.`);
    }
    const extra = bytes % R === 0 ? `it holds ${bytes / R} records` : 'the data is not a whole number of records';
    return new ComtradeError({ file: this.file, offset: this.baseOffset + wanted }, `${what}; ${extra}. Does the .dat belong to this .cfg?`);
  }

  /** Reads the complete records of the next chunk. */
  push(chunk: Uint8Array): void {
    const R = this.recordBytes;
    let pos = 0;
    if (this.carried > 0) {
      const need = Math.min(R - this.carried, chunk.length);
      this.carry.set(chunk.subarray(0, need), this.carried);
      this.carried += need;
      pos = need;
      if (this.carried < R) return;
      this.records(new DataView(this.carry.buffer), 0, 1);
      this.carried = 0;
    }
    const whole = Math.floor((chunk.length - pos) / R);
    if (whole > 0) this.records(new DataView(chunk.buffer, chunk.byteOffset, chunk.byteLength), pos, whole);
    pos += whole * R;
    this.carry.set(chunk.subarray(pos), 0);
    this.carried = chunk.length - pos;
  }

  private records(dv: DataView, at: number, count: number): void {
    const c = this.cols;
    const { samples, factor, offset, timestamps } = c;
    const analog = samples.length;
    const words = this.previousWords.length;
    const type = c.cfg.fileType;
    if (c.records + count > c.cfg.sampleCount) throw new ComtradeError({ file: this.file, offset: this.baseOffset + c.cfg.sampleCount * this.recordBytes }, 'more records than the .cfg declares.');
    for (let k = 0; k < count; k++, at += this.recordBytes) {
      const row = c.records++;
      if (timestamps) {
        const ts = dv.getUint32(at + 4, true);
        if (ts === MISSING_TIMESTAMP) c.missingTimestamp(row);
        timestamps[row] = ts;
      }
      let p = at + 8;
      if (type === 'BINARY') {
        for (let ch = 0; ch < analog; ch++, p += 2) {
          const raw = dv.getInt16(p, true);
          if (raw === MISSING_INT16) c.invalid(ch, row);
          else samples[ch][row] = raw * factor[ch] + offset[ch];
        }
      } else if (type === 'BINARY32') {
        for (let ch = 0; ch < analog; ch++, p += 4) {
          const raw = dv.getInt32(p, true);
          if (raw === MISSING_INT32) c.invalid(ch, row);
          else samples[ch][row] = raw * factor[ch] + offset[ch];
        }
      } else {
        for (let ch = 0; ch < analog; ch++, p += 4) {
          const raw = dv.getFloat32(p, true);
          if (raw - raw !== 0) c.invalid(ch, row);
          else samples[ch][row] = raw * factor[ch] + offset[ch];
        }
      }
      for (let w = 0; w < words; w++, p += 2) {
        const word = dv.getUint16(p, true);
        if (row === 0 || word !== this.previousWords[w]) c.digital.setWord(w, row, word, this.previousWords[w]);
        this.previousWords[w] = word;
      }
    }
  }

  /** Ends the data; the size was checked at the start, so every record has been read. */
  finish(): void {
    if (this.carried > 0 || this.cols.records !== this.cols.cfg.sampleCount) {
      throw new ComtradeError({ file: this.file, offset: this.baseOffset + this.cols.records * this.recordBytes }, `the data ends inside record ${this.cols.records + 1}; the .cfg declares ${this.cols.cfg.sampleCount.toLocaleString('en-US')} records.`);
    }
  }

  /** The byte offset of a record in its file, for errors about a record found later (its time stamp). */
  offsetOf(row: number): number {
    return this.baseOffset + row * this.recordBytes;
  }
}
