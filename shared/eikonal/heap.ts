/**
 * Indexed 4-ary min-heap on typed arrays, keyed by travel time, with decrease-key and raise-key.
 * No per-node objects: keys and node ids live in parallel arrays and pos[node] finds a node's
 * slot, so a tentative time can be changed in O(log n) (Sethian 1999, "Level Set Methods and
 * Fast Marching Methods", Cambridge Univ. Press, §8.3: the heap of the narrow band). Four
 * children per slot halve the depth of a binary heap; pops compare four keys per level but touch
 * half as many cache lines (d-ary heaps: Johnson 1975, Inf. Process. Lett. 4, 53–57).
 * Order of equal keys is not specified; times are exact either way.
 */
export class IndexedMinHeap {
  private keys: Float64Array;
  private nodes: Int32Array;
  /** Slot of each node in the heap, −1 when not in it. */
  private pos: Int32Array;
  size = 0;

  constructor(nodeCount: number) {
    this.keys = new Float64Array(nodeCount);
    this.nodes = new Int32Array(nodeCount);
    this.pos = new Int32Array(nodeCount).fill(-1);
  }

  /** Empties the heap (only the nodes still inside need resetting). */
  clear(): void {
    for (let k = 0; k < this.size; k++) this.pos[this.nodes[k]] = -1;
    this.size = 0;
  }

  has(node: number): boolean {
    return this.pos[node] >= 0;
  }

  peekKey(): number {
    return this.keys[0];
  }

  /** Insert a node, or lower its key when already present (never raises a key). */
  pushOrDecrease(node: number, key: number): void {
    let k = this.pos[node];
    if (k < 0) k = this.size++;
    else if (key >= this.keys[k]) return;
    this.siftUp(k, node, key);
  }

  /** Set a node's key up or down (inserting it when absent). */
  update(node: number, key: number): void {
    const k = this.pos[node];
    if (k < 0) this.siftUp(this.size++, node, key);
    else if (key < this.keys[k]) this.siftUp(k, node, key);
    else this.siftDown(k, node, key);
  }

  /** Remove and return the node with the smallest key (heap must be non-empty). */
  pop(): number {
    const top = this.nodes[0];
    this.pos[top] = -1;
    const n = --this.size;
    if (n > 0) this.siftDown(0, this.nodes[n], this.keys[n]);
    return top;
  }

  /** Place (node, key) at slot k or above, moving larger parents down. */
  private siftUp(k: number, node: number, key: number): void {
    const keys = this.keys;
    const nodes = this.nodes;
    const pos = this.pos;
    while (k > 0) {
      const parent = (k - 1) >> 2;
      const pk = keys[parent];
      if (pk <= key) break;
      keys[k] = pk;
      const pn = nodes[parent];
      nodes[k] = pn;
      pos[pn] = k;
      k = parent;
    }
    keys[k] = key;
    nodes[k] = node;
    pos[node] = k;
  }

  /** Place (node, key) at slot k or below, moving the smallest child up. */
  private siftDown(k: number, node: number, key: number): void {
    const keys = this.keys;
    const nodes = this.nodes;
    const pos = this.pos;
    const n = this.size;
    for (;;) {
      const first = 4 * k + 1;
      if (first >= n) break;
      let child = first;
      let ck = keys[first];
      const last = first + 4 < n ? first + 4 : n;
      for (let c = first + 1; c < last; c++) {
        const v = keys[c];
        if (v < ck) {
          ck = v;
          child = c;
        }
      }
      if (ck >= key) break;
      keys[k] = ck;
      const cn = nodes[child];
      nodes[k] = cn;
      pos[cn] = k;
      k = child;
    }
    keys[k] = key;
    nodes[k] = node;
    pos[node] = k;
  }
}
