/**
 * Node ordering for the envelope LDLᵀ factorisation: reverse Cuthill–McKee numbering keeps the
 * rows' envelopes (first to last non-zero) narrow. A resistor string with pendant outputs then
 * factors in time proportional to its size instead of its cube.
 */

/**
 * Reverse Cuthill–McKee order of an undirected graph on `n` vertices given as edge pairs. Returns
 * the new index of every vertex. Each connected part starts from a vertex of least degree; ties,
 * here and among the neighbours queued from one vertex, go to the lower vertex number. Every
 * analysis builds one, so it works on flat arrays, plain ones: a typed array of its own costs
 * about half a microsecond to make, more than this whole search on a small graph.
 */
export function reverseCuthillMcKee(n: number, edges: [number, number][]): Int32Array {
  // Adjacency in compressed rows: the neighbours of v are adj[at[v]] .. adj[at[v + 1] − 1].
  const degree = zeros(n);
  for (const [a, b] of edges) {
    if (a === b) continue;
    degree[a]++;
    degree[b]++;
  }
  const at = zeros(n + 1);
  for (let v = 0; v < n; v++) at[v + 1] = at[v] + degree[v];
  const fill = at.slice(0, n);
  const adj = zeros(at[n]);
  for (const [a, b] of edges) {
    if (a === b) continue;
    adj[fill[a]++] = b;
    adj[fill[b]++] = a;
  }
  const before = (p: number, q: number) => degree[p] < degree[q] || (degree[p] === degree[q] && p < q);
  // Vertices by (degree, number): insertion sort, as the graphs are small.
  const byDegree = zeros(n);
  for (let v = 0; v < n; v++) {
    let k = v;
    while (k > 0 && before(v, byDegree[k - 1])) {
      byDegree[k] = byDegree[k - 1];
      k--;
    }
    byDegree[k] = v;
  }
  const seen = zeros(n);
  const queue = zeros(n);
  let widest = 0;
  for (let v = 0; v < n; v++) widest = Math.max(widest, degree[v]);
  const next = zeros(widest);
  let length = 0;
  for (let s = 0; s < n; s++) {
    const start = byDegree[s];
    if (seen[start]) continue;
    seen[start] = 1;
    queue[length++] = start;
    for (let head = length - 1; head < length; head++) {
      const v = queue[head];
      // Unseen neighbours by (degree, number); a neighbour listed twice (parallel branches) once.
      let count = 0;
      for (let e = at[v]; e < at[v + 1]; e++) {
        const w = adj[e];
        if (seen[w]) continue;
        let k = count++;
        while (k > 0 && before(w, next[k - 1])) {
          next[k] = next[k - 1];
          k--;
        }
        next[k] = w;
      }
      for (let k = 0; k < count; k++) {
        const w = next[k];
        if (seen[w]) continue;
        seen[w] = 1;
        queue[length++] = w;
      }
    }
  }
  // Reversed: the last vertex queued gets index 0.
  const index = new Int32Array(n);
  for (let k = 0; k < n; k++) index[queue[k]] = n - 1 - k;
  return index;
}

/** `n` zeros in a plain array (small integers, kept unboxed). */
function zeros(n: number): number[] {
  return new Array<number>(n).fill(0);
}

/** For each row of the reordered matrix, the column of its first non-zero (the envelope start). */
export function envelopeStarts(n: number, edges: [number, number][], index: Int32Array): Int32Array {
  const first = new Int32Array(n);
  for (let i = 0; i < n; i++) first[i] = i;
  for (const [a, b] of edges) {
    const i = index[a];
    const j = index[b];
    if (i > j && j < first[i]) first[i] = j;
    if (j > i && i < first[j]) first[j] = i;
  }
  return first;
}
