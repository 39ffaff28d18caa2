// A growable pair of Float64Arrays: the good rows' times (s) and currents (A), 16 bytes a row.

export class SampleBuffer {
  t: Float64Array;
  i: Float64Array;
  length = 0;

  constructor(capacity = 1 << 14) {
    this.t = new Float64Array(capacity);
    this.i = new Float64Array(capacity);
  }

  push(t: number, i: number): void {
    if (this.length === this.t.length) this.grow();
    this.t[this.length] = t;
    this.i[this.length] = i;
    this.length++;
  }

  private grow(): void {
    const size = this.t.length * 2;
    const t = new Float64Array(size);
    const i = new Float64Array(size);
    t.set(this.t);
    i.set(this.i);
    this.t = t;
    this.i = i;
  }

  /** Views of the filled part (no copy). */
  views(): { t: Float64Array; i: Float64Array } {
    return { t: this.t.subarray(0, this.length), i: this.i.subarray(0, this.length) };
  }
}
