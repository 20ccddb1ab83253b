/**
 * Test-signal generators. Each samples a waveform of period 1 at the midpoints of `perCycle` equal steps
 * per cycle, over `cycles` whole cycles, so a record holds exactly whole cycles and no sample falls on an
 * edge (edge samples would bias the closed-form values; see the caution on sampled square waves).
 */
export function sampled(shape: (phase: number) => number, perCycle: number, cycles: number, phaseShift = 0): Float64Array {
  const n = perCycle * cycles;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const t = (i + 0.5) / perCycle + phaseShift;
    out[i] = shape(t - Math.floor(t));
  }
  return out;
}

const TWO_PI = 2 * Math.PI;

export const shapes = {
  sine: (A: number) => (p: number) => A * Math.sin(TWO_PI * p),
  fullWave: (A: number) => (p: number) => A * Math.abs(Math.sin(TWO_PI * p)),
  halfWave: (A: number) => (p: number) => Math.max(0, A * Math.sin(TWO_PI * p)),
  square: (A: number) => (p: number) => (p < 0.5 ? A : -A),
  pulse: (A: number, duty: number) => (p: number) => (p < duty ? A : 0),
  /** Bipolar triangle ±A, peak at a quarter period. */
  triangle: (A: number) => (p: number) => (p < 0.25 ? 4 * A * p : p < 0.75 ? A * (2 - 4 * p) : A * (4 * p - 4)),
  /** Rising ramp from −A to +A. */
  sawtooth: (A: number) => (p: number) => A * (2 * p - 1),
  /** Sine conducting from firing angle α to π in each half-cycle (a leading-edge dimmer). */
  phaseCut: (A: number, alphaRad: number) => (p: number) => {
    const theta = TWO_PI * p;
    const inHalf = theta % Math.PI;
    return inHalf >= alphaRad ? A * Math.sin(theta) : 0;
  },
  dcPlusSine: (dc: number, A: number) => (p: number) => dc + A * Math.sin(TWO_PI * p),
};

/** A finite Fourier series Σ peak_h·sin(2πhp + φ_h): band-limited by construction, so a DFT is exact. */
export function fourierSeries(terms: { order: number; peak: number; phaseRad?: number }[], dc = 0) {
  return (p: number) => terms.reduce((s, t) => s + t.peak * Math.sin(TWO_PI * t.order * p + (t.phaseRad ?? 0)), dc);
}

/** Deterministic pseudo-random numbers (mulberry32) so noisy tests are repeatable. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Gaussian noise of standard deviation sigma (Box–Muller). */
export function gaussian(rand: () => number, sigma: number): number {
  const u = Math.max(rand(), 1e-300);
  return sigma * Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * rand());
}
