/** A Float64 column that grows by doubling; `values()` is a view, not a copy. */
export class GrowableColumn {
  private data: Float64Array;
  length = 0;

  constructor(initialCapacity = 1024) {
    this.data = new Float64Array(Math.max(16, initialCapacity));
  }

  push(v: number): void {
    if (this.length === this.data.length) {
      const bigger = new Float64Array(this.data.length * 2);
      bigger.set(this.data);
      this.data = bigger;
    }
    this.data[this.length++] = v;
  }

  last(): number {
    return this.data[this.length - 1];
  }

  values(): Float64Array {
    return this.data.subarray(0, this.length);
  }
}
