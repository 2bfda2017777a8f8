/**
 * A bounded table of rows — a time and a fixed number of value columns — held in Float64Arrays.
 * Once full, each new row overwrites the oldest, so memory never grows with a live stream.
 * Missing values are NaN; `toAlignedData()` turns them into the nulls uPlot draws as gaps.
 * Rows are addressed from the newest: `back = 0` is the newest row, `back = length − 1` the oldest.
 */
export class RingBuffer {
  readonly capacity: number;
  readonly columns: number;
  private readonly times: Float64Array;
  private readonly values: Float64Array[];
  private head = 0;
  private count = 0;

  constructor(capacity: number, columns: number) {
    if (!Number.isInteger(capacity) || capacity < 1)
      throw new RangeError(`capacity must be a positive integer, not ${capacity}`);
    if (!Number.isInteger(columns) || columns < 0)
      throw new RangeError(`columns must be a whole number, not ${columns}`);
    this.capacity = capacity;
    this.columns = columns;
    this.times = new Float64Array(capacity);
    this.values = Array.from({ length: columns }, () => new Float64Array(capacity));
  }

  get length(): number {
    return this.count;
  }

  clear(): void {
    this.head = 0;
    this.count = 0;
  }

  /** Appends a row (values beyond `columns` are ignored, missing ones are NaN). */
  push(t: number, row: ArrayLike<number>): void {
    const slot = this.head;
    this.writeSlot(slot, t, row);
    this.head = (slot + 1) % this.capacity;
    if (this.count < this.capacity) this.count += 1;
  }

  timeAt(back: number): number {
    return this.times[this.slotOf(back)];
  }

  valueAt(back: number, column: number): number {
    return this.values[column][this.slotOf(back)];
  }

  /** Overwrites the row `back` places from the newest. */
  set(back: number, t: number, row: ArrayLike<number>): void {
    this.writeSlot(this.slotOf(back), t, row);
  }

  /** Reads the row `back` places from the newest into `into` and returns its time. */
  read(back: number, into: Float64Array): number {
    const slot = this.slotOf(back);
    for (let c = 0; c < this.columns; c++) into[c] = this.values[c][slot];
    return this.times[slot];
  }

  /**
   * Inserts a row just older than the row now at `back`, for a late sample; it ends up at
   * `back + 1`. The rows newer than it keep their order; when full, the oldest row drops out.
   */
  insertOlderThan(back: number, t: number, row: ArrayLike<number>): void {
    const scratch = new Float64Array(this.columns);
    this.push(this.read(0, scratch), scratch);
    for (let b = 1; b <= back; b++) this.set(b, this.read(b + 1, scratch), scratch);
    this.set(back + 1, t, row);
  }

  /** Oldest first: times and one array per column, NaN as null. */
  toAlignedData(): [number[], ...(number | null)[][]] {
    const t: number[] = new Array<number>(this.count);
    const columns = this.values.map(() => new Array<number | null>(this.count));
    for (let i = 0; i < this.count; i++) {
      const slot = this.slotOf(this.count - 1 - i);
      t[i] = this.times[slot];
      for (let c = 0; c < this.columns; c++) {
        const v = this.values[c][slot];
        columns[c][i] = Number.isNaN(v) ? null : v;
      }
    }
    return [t, ...columns];
  }

  private slotOf(back: number): number {
    if (!Number.isInteger(back) || back < 0 || back >= this.count) {
      throw new RangeError(`row ${back} back is outside the ${this.count} rows held`);
    }
    return (this.head - 1 - back + 2 * this.capacity) % this.capacity;
  }

  private writeSlot(slot: number, t: number, row: ArrayLike<number>): void {
    this.times[slot] = t;
    for (let c = 0; c < this.columns; c++) this.values[c][slot] = c < row.length ? row[c] : NaN;
  }
}
