/** A digital channel's state from one sample on. */
export interface StateChange {
  /** 0-based record index. */
  sample: number;
  state: 0 | 1;
}

/**
 * Follows the digital channels record by record and keeps where each changes state: the first
 * `maxKept` changes of a channel, and a count of all. A chattering contact thus costs a bounded amount.
 */
export class DigitalStates {
  readonly initial: Uint8Array;
  readonly current: Uint8Array;
  readonly changeCount: Float64Array;
  readonly changes: StateChange[][];

  constructor(
    readonly count: number,
    private readonly maxKept: number,
  ) {
    this.initial = new Uint8Array(count);
    this.current = new Uint8Array(count);
    this.changeCount = new Float64Array(count);
    this.changes = Array.from({ length: count }, () => []);
  }

  /** The state of channel `ch` (0-based) at record `sample`; the first record sets the initial states. */
  set(ch: number, sample: number, state: 0 | 1): void {
    if (sample === 0) {
      this.initial[ch] = state;
      this.current[ch] = state;
      return;
    }
    if (this.current[ch] === state) return;
    this.current[ch] = state;
    this.changeCount[ch]++;
    if (this.changes[ch].length < this.maxKept) this.changes[ch].push({ sample, state });
  }

  /**
   * A binary record's status word `w` (channels 16w+1 to 16w+16, the first in the least significant
   * bit; from memory), compared with the last one so that an unchanged word costs one comparison.
   */
  setWord(w: number, sample: number, word: number, previous: number): void {
    let changed = sample === 0 ? 0xffff : word ^ previous;
    while (changed !== 0) {
      const bit = 31 - Math.clz32(changed & -changed);
      changed &= changed - 1;
      const ch = w * 16 + bit;
      if (ch < this.count) this.set(ch, sample, ((word >> bit) & 1) as 0 | 1);
    }
  }
}
