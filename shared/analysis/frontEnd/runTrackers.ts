/**
 * What the run keeps of the converter output, fed block by block so a long looped run never holds
 * its whole output: the envelope for the chart, the display's samples, and the settling time.
 */

/** Min and max of each bucket, in time order: at most 2 points a bucket, and no ripple aliased into a slow wave as picking every k-th sample would. */
export class EnvelopeTrace {
  private readonly at: number[] = [];
  private readonly values: number[] = [];
  private loI = 0;
  private loV = Infinity;
  private hiI = 0;
  private hiV = -Infinity;
  private filled = 0;
  private readonly bucket: number;

  constructor(plannedSamples: number, maxPoints: number) {
    this.bucket = plannedSamples <= maxPoints ? 1 : Math.ceil(plannedSamples / Math.floor(maxPoints / 2));
  }

  push(buf: Float64Array, n: number, offset: number): void {
    if (this.bucket === 1) {
      for (let k = 0; k < n; k++) this.add(offset + k, buf[k]);
      return;
    }
    for (let k = 0; k < n; k++) {
      const v = buf[k];
      if (v < this.loV) { this.loV = v; this.loI = offset + k; }
      if (v > this.hiV) { this.hiV = v; this.hiI = offset + k; }
      if (++this.filled === this.bucket) this.flush();
    }
  }

  private add(i: number, v: number): void {
    this.at.push(i);
    this.values.push(v);
  }

  private flush(): void {
    if (this.filled === 0) return;
    if (this.loI === this.hiI) this.add(this.loI, this.loV);
    else if (this.loI < this.hiI) { this.add(this.loI, this.loV); this.add(this.hiI, this.hiV); }
    else { this.add(this.hiI, this.hiV); this.add(this.loI, this.loV); }
    this.loV = Infinity;
    this.hiV = -Infinity;
    this.filled = 0;
  }

  finish(sampleRateHz: number): { tS: number; value: number }[] {
    this.flush();
    return this.at.map((i, k) => ({ tS: i / sampleRateHz, value: this.values[k] }));
  }
}

/**
 * The display's sample-and-hold: the converter output at t = k/rate, k = 1, 2, … (from k = 0 when the
 * meter was already reading before the run, so its display shows a value from the start).
 */
export class DisplaySampler {
  readonly samples: { tS: number; value: number }[] = [];
  private k: number;

  constructor(private readonly rateHz: number, private readonly sampleRateHz: number, alreadyShowing = false) {
    this.k = alreadyShowing ? 0 : 1;
  }

  push(buf: Float64Array, n: number, offset: number): void {
    for (;;) {
      const i = Math.round((this.k * this.sampleRateHz) / this.rateHz);
      if (i >= offset + n) return;
      this.samples.push({ tS: this.k / this.rateHz, value: buf[i - offset] });
      this.k++;
    }
  }
}

/**
 * When the reading enters and stays within ±1 % of `final`. The ripple is taken out first by a moving
 * average over one fundamental period (`periodSamples`, or none when aperiodic), so the time says when
 * the reading's level has settled; whether the ripple itself is small enough is judged apart.
 */
export class SettlingTracker {
  private readonly ring: Float64Array;
  private slot = 0;
  private sum = 0;
  private seen = 0;
  /** Index (centre of the averaging window) of the last trend value outside the band, or −1. */
  private lastOutside = -1;
  private lastIndex = -1;
  private readonly band: number;

  constructor(private readonly final: number, periodSamples: number | null, relativeBand = 0.01) {
    this.ring = new Float64Array(periodSamples !== null && periodSamples >= 2 ? Math.round(periodSamples) : 1);
    this.band = Math.max(relativeBand * Math.abs(final), Number.MIN_VALUE);
  }

  push(buf: Float64Array, n: number, offset: number): void {
    const { ring, final, band } = this;
    const P = ring.length;
    const lag = (P - 1) / 2;
    let { slot, sum, seen, lastOutside } = this;
    for (let k = 0; k < n; k++) {
      const v = buf[k];
      sum += v - ring[slot];
      ring[slot] = v;
      if (++slot === P) {
        slot = 0;
        // Re-add from the ring once a period: a running sum over millions of samples would drift.
        sum = 0;
        for (let j = 0; j < P; j++) sum += ring[j];
      }
      seen++;
      // Until a whole period has been seen, the mean of what has been.
      if (Math.abs(sum / (seen < P ? seen : P) - final) > band) lastOutside = offset + k - lag;
    }
    this.slot = slot;
    this.sum = sum;
    this.seen = seen;
    this.lastOutside = lastOutside;
    this.lastIndex = offset + n - 1 - lag;
  }

  /** Seconds from the start to the settled reading, or null while the latest trend value is outside the band. */
  settlingTimeS(sampleRateHz: number): number | null {
    if (this.lastIndex < 0 || this.lastOutside >= this.lastIndex) return null;
    return Math.max(0, this.lastOutside + 1) / sampleRateHz;
  }
}
