/**
 * A monotone priority queue of cells keyed by float32 elevation: a radix heap (Ahuja,
 * Mehlhorn, Orlin & Tarjan 1990, "Faster algorithms for the shortest path problem", J. ACM 37).
 * The flood only ever asks for keys at or above the last one taken, which is what a radix heap
 * needs; a push is O(1) and each cell moves down at most 32 buckets, against a binary heap's
 * log₂(n) comparisons on every push and pop. Keys are the float's bits mapped so that unsigned
 * integer order is numeric order.
 */
const f32 = new Float32Array(1);
const u32 = new Uint32Array(f32.buffer);

/** Unsigned 32-bit key with the same order as the float32 value (NaN never comes here). */
export function orderedBits(value: number): number {
  f32[0] = value;
  const bits = u32[0]!;
  return (bits & 0x80000000 ? ~bits : bits | 0x80000000) >>> 0;
}

export class RadixHeap {
  private readonly cells: Int32Array[] = [];
  private readonly keys: Uint32Array[] = [];
  private readonly sizes = new Int32Array(33);
  private last = 0;
  size = 0;

  constructor() {
    for (let b = 0; b < 33; b += 1) {
      this.cells.push(new Int32Array(16));
      this.keys.push(new Uint32Array(16));
    }
  }

  /** Whether a cell with the key last taken is still waiting. */
  get hasLastKey(): boolean {
    return this.sizes[0]! > 0;
  }

  /** Adds a cell; its key must not be below the last key taken. */
  push(cell: number, key: number): void {
    const diff = (key ^ this.last) >>> 0;
    this.put(diff === 0 ? 0 : 32 - Math.clz32(diff), cell, key);
    this.size += 1;
  }

  /** Removes a cell of the lowest key (the heap must not be empty). */
  pop(): number {
    if (this.sizes[0] === 0) this.refill();
    this.size -= 1;
    const top = this.sizes[0]! - 1;
    this.sizes[0] = top;
    return this.cells[0]![top]!;
  }

  /** Moves the lowest non-empty bucket down around its smallest key. */
  private refill(): void {
    let b = 1;
    while (this.sizes[b] === 0) b += 1;
    const cells = this.cells[b]!;
    const keys = this.keys[b]!;
    const count = this.sizes[b]!;
    let min = keys[0]!;
    for (let i = 1; i < count; i += 1) if (keys[i]! < min) min = keys[i]!;
    this.last = min;
    this.sizes[b] = 0;
    for (let i = 0; i < count; i += 1) {
      const diff = (keys[i]! ^ min) >>> 0;
      this.put(diff === 0 ? 0 : 32 - Math.clz32(diff), cells[i]!, keys[i]!);
    }
  }

  private put(bucket: number, cell: number, key: number): void {
    const at = this.sizes[bucket]!;
    if (at === this.cells[bucket]!.length) {
      const cells = new Int32Array(at * 2);
      const keys = new Uint32Array(at * 2);
      cells.set(this.cells[bucket]!);
      keys.set(this.keys[bucket]!);
      this.cells[bucket] = cells;
      this.keys[bucket] = keys;
    }
    this.cells[bucket]![at] = cell;
    this.keys[bucket]![at] = key;
    this.sizes[bucket] = at + 1;
  }
}
