/**
 * Maximum-cardinality matching in a general graph: Edmonds' blossom algorithm
 * (J. Edmonds, "Paths, trees, and flowers", Can. J. Math. 17 (1965) 449), in the O(V³)
 * breadth-first form with blossom contraction by base relabelling (as in the standard
 * competitive-programming formulation, e.g. e-maxx "Edmonds' algorithm"; written from memory).
 * Used to find a Kekulé-type localized structure for the delocalization energy.
 */

/** Partner of each vertex in a maximum matching, or −1; `adjacency[v]` lists v's neighbours. */
export function maximumMatching(adjacency: readonly (readonly number[])[]): number[] {
  const n = adjacency.length;
  const match = new Array<number>(n).fill(-1);
  const parent = new Array<number>(n).fill(-1);
  const base = Array.from({ length: n }, (_, i) => i);
  const used = new Array<boolean>(n).fill(false);
  const blossom = new Array<boolean>(n).fill(false);

  const lowestCommonAncestor = (a0: number, b0: number): number => {
    const seen = new Array<boolean>(n).fill(false);
    let a = a0;
    for (;;) {
      a = base[a];
      seen[a] = true;
      if (match[a] === -1) break;
      a = parent[match[a]];
    }
    let b = b0;
    for (;;) {
      b = base[b];
      if (seen[b]) return b;
      b = parent[match[b]];
    }
  };

  const markPath = (v0: number, b: number, child0: number) => {
    let v = v0;
    let child = child0;
    while (base[v] !== b) {
      blossom[base[v]] = true;
      blossom[base[match[v]]] = true;
      parent[v] = child;
      child = match[v];
      v = parent[match[v]];
    }
  };

  const findAugmentingPath = (root: number): number => {
    used.fill(false);
    parent.fill(-1);
    for (let i = 0; i < n; i++) base[i] = i;
    used[root] = true;
    const queue = [root];
    for (let head = 0; head < queue.length; head++) {
      const v = queue[head];
      for (const to of adjacency[v]) {
        if (base[v] === base[to] || match[v] === to) continue;
        if (to === root || (match[to] !== -1 && parent[match[to]] !== -1)) {
          const current = lowestCommonAncestor(v, to);
          blossom.fill(false);
          markPath(v, current, to);
          markPath(to, current, v);
          for (let i = 0; i < n; i++) {
            if (blossom[base[i]]) {
              base[i] = current;
              if (!used[i]) {
                used[i] = true;
                queue.push(i);
              }
            }
          }
        } else if (parent[to] === -1) {
          parent[to] = v;
          if (match[to] === -1) return to;
          const next = match[to];
          used[next] = true;
          queue.push(next);
        }
      }
    }
    return -1;
  };

  for (let root = 0; root < n; root++) {
    if (match[root] !== -1) continue;
    let v = findAugmentingPath(root);
    while (v !== -1) {
      const pv = parent[v];
      const ppv = match[pv];
      match[v] = pv;
      match[pv] = v;
      v = ppv;
    }
  }
  return match;
}
