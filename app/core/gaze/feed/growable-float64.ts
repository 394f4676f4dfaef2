/** An append-only Float64Array that doubles its storage as it fills. */
export class GrowableFloat64 {
  private data = new Float64Array(1024);
  private size = 0;

  get length(): number {
    return this.size;
  }

  push(value: number): void {
    if (this.size === this.data.length) {
      const bigger = new Float64Array(this.data.length * 2);
      bigger.set(this.data);
      this.data = bigger;
    }
    this.data[this.size++] = value;
  }

  /** A copy of the values pushed so far. */
  toArray(): Float64Array {
    return this.data.slice(0, this.size);
  }
}
