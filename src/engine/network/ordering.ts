/**
 * Node ordering for the envelope LDLᵀ factorisation: reverse Cuthill–McKee numbering keeps the
 * rows' envelopes (first to last non-zero) narrow. A resistor string with pendant outputs then
 * factors in time proportional to its size instead of its cube.
 */

/**
 * Reverse Cuthill–McKee order of an undirected graph on `n` vertices given as edge pairs. Returns
 * the new index of every vertex. Each connected part starts from a vertex of least degree.
 */
export function reverseCuthillMcKee(n: number, edges: [number, number][]): Int32Array {
  const adj: number[][] = Array.from({ length: n }, () => []);
  for (const [a, b] of edges) {
    if (a === b) continue;
    adj[a].push(b);
    adj[b].push(a);
  }
  const degree = adj.map((l) => l.length);
  const order: number[] = [];
  const seen = new Uint8Array(n);
  const byDegree = [...Array(n).keys()].sort((p, q) => degree[p] - degree[q] || p - q);
  for (const start of byDegree) {
    if (seen[start]) continue;
    seen[start] = 1;
    const queue = [start];
    for (let head = 0; head < queue.length; head++) {
      const v = queue[head];
      order.push(v);
      const next = adj[v].filter((w) => !seen[w]).sort((p, q) => degree[p] - degree[q] || p - q);
      for (const w of next) {
        if (seen[w]) continue;
        seen[w] = 1;
        queue.push(w);
      }
    }
  }
  const index = new Int32Array(n);
  order.reverse().forEach((v, k) => (index[v] = k));
  return index;
}

/** For each row of the reordered matrix, the column of its first non-zero (the envelope start). */
export function envelopeStarts(n: number, edges: [number, number][], index: Int32Array): Int32Array {
  const first = Int32Array.from({ length: n }, (_, i) => i);
  for (const [a, b] of edges) {
    const i = index[a];
    const j = index[b];
    if (i > j && j < first[i]) first[i] = j;
    if (j > i && i < first[j]) first[j] = i;
  }
  return first;
}
