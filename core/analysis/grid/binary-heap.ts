/**
 * A min-heap of (key, cell) pairs in growable typed arrays. Decrease-key is done by pushing again;
 * callers skip stale entries whose key exceeds the settled distance (docs/reference/locator-methods.md §5, pitfall 7).
 */
export class MinHeap {
  private keys: Float64Array;
  private items: Int32Array;
  size = 0;

  constructor(capacity = 1024) {
    this.keys = new Float64Array(capacity);
    this.items = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  push(key: number, item: number): void {
    if (this.size === this.keys.length) this.grow();
    let i = this.size++;
    const keys = this.keys;
    const items = this.items;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (keys[parent] <= key) break;
      keys[i] = keys[parent];
      items[i] = items[parent];
      i = parent;
    }
    keys[i] = key;
    items[i] = item;
  }

  /** Key of the top entry; only valid when size > 0. */
  peekKey(): number {
    return this.keys[0];
  }

  /** Removes the top entry and returns its item; read its key with peekKey() first. */
  pop(): number {
    const keys = this.keys;
    const items = this.items;
    const top = items[0];
    const n = --this.size;
    if (n > 0) {
      const key = keys[n];
      const item = items[n];
      let i = 0;
      for (;;) {
        let c = 2 * i + 1;
        if (c >= n) break;
        if (c + 1 < n && keys[c + 1] < keys[c]) c++;
        if (keys[c] >= key) break;
        keys[i] = keys[c];
        items[i] = items[c];
        i = c;
      }
      keys[i] = key;
      items[i] = item;
    }
    return top;
  }

  private grow(): void {
    const keys = new Float64Array(this.keys.length * 2);
    keys.set(this.keys);
    const items = new Int32Array(this.items.length * 2);
    items.set(this.items);
    this.keys = keys;
    this.items = items;
  }
}
