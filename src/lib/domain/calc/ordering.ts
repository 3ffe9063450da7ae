/**
 * Fill-reducing ordering for the sparse LDLᵀ factorisation: minimum degree (Tinney's scheme 2),
 * simulated on the explicit elimination graph. Grounding networks are mostly trees, where
 * minimum degree eliminates leaves first and creates no fill at all.
 */

/** Binary min-heap of (key, value) with lazy deletion, for the minimum-degree ordering. */
class MinHeap {
  private keys: number[] = [];
  private values: number[] = [];
  get length(): number {
    return this.keys.length;
  }
  push(key: number, value: number): void {
    const { keys, values } = this;
    let i = keys.length;
    keys.push(key);
    values.push(value);
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (keys[parent] <= key) break;
      keys[i] = keys[parent];
      values[i] = values[parent];
      i = parent;
    }
    keys[i] = key;
    values[i] = value;
  }
  /** Removes the smallest entry and returns its [key, value]. */
  pop(): [number, number] {
    const { keys, values } = this;
    const top: [number, number] = [keys[0], values[0]];
    const lastKey = keys.pop() as number;
    const lastValue = values.pop() as number;
    const n = keys.length;
    if (n > 0) {
      let i = 0;
      for (;;) {
        let child = 2 * i + 1;
        if (child >= n) break;
        if (child + 1 < n && keys[child + 1] < keys[child]) child += 1;
        if (keys[child] >= lastKey) break;
        keys[i] = keys[child];
        values[i] = values[child];
        i = child;
      }
      keys[i] = lastKey;
      values[i] = lastValue;
    }
    return top;
  }
}

/**
 * Minimum-degree elimination on the matrix graph. Returns the order and, for each eliminated
 * vertex, its neighbours at elimination time: exactly the row pattern of its column of L.
 */
export function minimumDegreeOrder(size: number, offRow: Int32Array, offCol: Int32Array): { order: Int32Array; pattern: number[][] } {
  const adjacency: Set<number>[] = Array.from({ length: size }, () => new Set<number>());
  for (let e = 0; e < offRow.length; e++) {
    adjacency[offRow[e]].add(offCol[e]);
    adjacency[offCol[e]].add(offRow[e]);
  }
  const heap = new MinHeap();
  for (let v = 0; v < size; v++) heap.push(adjacency[v].size, v);
  const done = new Uint8Array(size);
  const order = new Int32Array(size);
  const pattern: number[][] = new Array(size);
  let step = 0;
  while (heap.length > 0) {
    const [degree, v] = heap.pop();
    if (done[v] || degree !== adjacency[v].size) continue; // stale heap entry
    done[v] = 1;
    order[step++] = v;
    const neighbours = [...adjacency[v]];
    pattern[v] = neighbours;
    for (const a of neighbours) adjacency[a].delete(v);
    for (let i = 0; i < neighbours.length; i++) {
      const setA = adjacency[neighbours[i]];
      for (let j = i + 1; j < neighbours.length; j++) {
        if (!setA.has(neighbours[j])) {
          setA.add(neighbours[j]);
          adjacency[neighbours[j]].add(neighbours[i]);
        }
      }
    }
    for (const a of neighbours) heap.push(adjacency[a].size, a);
    adjacency[v].clear();
  }
  return { order, pattern };
}
