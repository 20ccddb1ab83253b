type Column = Float64Array | Uint32Array;

/**
 * A column of numbers (Float64 values, or Uint32 line numbers) that grows by doubling, but never beyond
 * `maxLength` values, so that a capped reader never holds more than its budget; `values()` is a view,
 * not a copy.
 */
export class GrowableColumn<A extends Column = Float64Array> {
  private data: A;
  length = 0;

  constructor(
    initialCapacity = 1024,
    private readonly maxLength = Infinity,
    private readonly make: (length: number) => A = (length) => new Float64Array(length) as A,
  ) {
    this.data = make(Math.min(Math.max(16, initialCapacity), maxLength));
  }

  /** Appends a value; pushing beyond `maxLength` is a programming error and throws a RangeError. */
  push(v: number): void {
    if (this.length === this.data.length) this.grow();
    this.data[this.length++] = v;
  }

  private grow(): void {
    if (this.length >= this.maxLength) throw new RangeError(`A column holds at most ${this.maxLength} values.`);
    const bigger = this.make(Math.min(Math.max(16, this.data.length * 2), this.maxLength));
    bigger.set(this.data);
    this.data = bigger;
  }

  last(): number {
    return this.data[this.length - 1];
  }

  values(): A {
    return this.data.subarray(0, this.length) as A;
  }
}
