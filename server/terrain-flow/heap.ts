/**
 * A binary min-heap of grid cells keyed by elevation, in two growable typed arrays (no objects
 * per entry). Ties come out in no particular order; the flood does not depend on it.
 */
export class CellHeap {
  private keys: Float64Array;
  private cells: Int32Array;
  size = 0;

  constructor(capacity = 1024) {
    this.keys = new Float64Array(capacity);
    this.cells = new Int32Array(capacity);
  }

  get topKey(): number {
    return this.keys[0]!;
  }

  push(cell: number, key: number): void {
    if (this.size === this.keys.length) this.grow();
    const keys = this.keys;
    const cells = this.cells;
    let i = this.size;
    this.size += 1;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const pk = keys[parent]!;
      if (pk <= key) break;
      keys[i] = pk;
      cells[i] = cells[parent]!;
      i = parent;
    }
    keys[i] = key;
    cells[i] = cell;
  }

  /** Removes and returns the cell with the lowest key (the heap must not be empty). */
  pop(): number {
    const keys = this.keys;
    const cells = this.cells;
    const top = cells[0]!;
    this.size -= 1;
    const n = this.size;
    if (n === 0) return top;
    const key = keys[n]!;
    const cell = cells[n]!;
    let i = 0;
    for (;;) {
      let child = 2 * i + 1;
      if (child >= n) break;
      const right = child + 1;
      if (right < n && keys[right]! < keys[child]!) child = right;
      if (keys[child]! >= key) break;
      keys[i] = keys[child]!;
      cells[i] = cells[child]!;
      i = child;
    }
    keys[i] = key;
    cells[i] = cell;
    return top;
  }

  private grow(): void {
    const keys = new Float64Array(this.keys.length * 2);
    const cells = new Int32Array(this.cells.length * 2);
    keys.set(this.keys);
    cells.set(this.cells);
    this.keys = keys;
    this.cells = cells;
  }
}

/** A growable FIFO of cells: a ring buffer whose capacity stays a power of two (mask, no %). */
export class CellQueue {
  private items = new Int32Array(1024);
  private mask = 1023;
  private head = 0;
  size = 0;

  push(cell: number): void {
    if (this.size === this.items.length) this.grow();
    this.items[(this.head + this.size) & this.mask] = cell;
    this.size += 1;
  }

  shift(): number {
    const cell = this.items[this.head]!;
    this.head = (this.head + 1) & this.mask;
    this.size -= 1;
    return cell;
  }

  private grow(): void {
    const items = new Int32Array(this.items.length * 2);
    for (let k = 0; k < this.size; k += 1) {
      items[k] = this.items[(this.head + k) & this.mask]!;
    }
    this.items = items;
    this.mask = items.length - 1;
    this.head = 0;
  }
}
