/** One block of a meter's front end: it transforms a buffer of samples in place. */
export interface Stage {
  process(buf: Float64Array, n: number): void;
}

/**
 * A stage with memory (a capacitor). `settle` processes one loop in place as it runs in the periodic
 * steady state reached when the loop repeats forever, and leaves the stage in that state.
 */
export interface StatefulStage extends Stage {
  reset(): void;
  settle(loop: Float64Array): void;
}

/** Whether a stage keeps state between blocks (and so must be settled or reset). */
export const isStateful = (s: Stage): s is StatefulStage => 'settle' in s;

/**
 * 1 − e^(−x), accurately for tiny x: at 5 MS/s a 10 s time constant gives x = 2·10⁻⁸, where
 * 1 − Math.exp(−x) keeps only half its digits.
 */
export const oneMinusExp = (x: number) => -Math.expm1(-x);
