// The graph a distance table searches: the sea graph's edges under one query's cost model, costed
// once (clearance penalty, area factors, avoided passages, limiting latitude) into a flat typed
// array instead of per relaxation, with the edges no shortest path needs left out, and a Dijkstra
// over it with an indexed binary heap (decrease-key, at most one entry per node) that worker
// threads can run (tableWorkers.ts).
//
// An edge u → v is left out when some neighbour x of u (not a passage's fairway node) gives
// cost(u, x) + cost(x, v) ≤ cost(u, v) with both parts > 0: by induction on the cost, every edge
// left out is replaced by a path of kept edges costing no more, so every shortest-path cost over
// the pruned graph equals the one over the full graph (the path may differ among ties). The
// quadtree joins each node to all nodes within 2.3 cell sizes, so about half its edges are such
// shortcuts of two shorter ones.
import type { CostModel } from './search'
import { edgeCost } from './search'
import type { SeaGraph } from './seaGraph'

export interface TableGraph {
  nodeCount: number
  offsets: Uint32Array
  targets: Uint32Array
  cost: Float64Array
  /** Edges kept against the sea graph's directed edges. */
  keptEdges: number
  allEdges: number
}

/** The costed, pruned graph of one query's cost model. */
export function tableGraph(g: SeaGraph, m: CostModel): TableGraph {
  const n = g.nodeCount, E = g.targets.length
  const w = new Float64Array(E)
  const usable = new Uint8Array(n)
  for (let v = 0; v < n; v++) usable[v] = Math.abs(g.lat[v]!) <= m.limitLat ? 1 : 0
  for (let u = 0; u < n; u++) {
    for (let k = g.offsets[u]!, end = g.offsets[u + 1]!; k < end; k++) {
      const v = g.targets[k]!
      w[k] = !usable[u] || !usable[v] || (m.blockedEdge && m.blockedEdge[k]) ? Infinity : edgeCost(g, k, u, v, m)
    }
  }
  // Per node: its neighbours' direct costs in a scratch array, then every two-edge path through a grid neighbour.
  const direct = new Float64Array(n)
  const neighbourOf = new Int32Array(n).fill(-1)
  const keep = new Uint8Array(E)
  let kept = 0
  for (let u = 0; u < n; u++) {
    const s = g.offsets[u]!, e = g.offsets[u + 1]!
    for (let k = s; k < e; k++) {
      const v = g.targets[k]!
      if (neighbourOf[v] !== u) { neighbourOf[v] = u; direct[v] = w[k]! }
      else if (w[k]! < direct[v]!) direct[v] = w[k]!
    }
    for (let k = s; k < e; k++) {
      const x = g.targets[k]!, wx = w[k]!
      if (wx === Infinity || !(wx > 0) || g.nodePassage[x]) continue
      for (let k2 = g.offsets[x]!, e2 = g.offsets[x + 1]!; k2 < e2; k2++) {
        const y = g.targets[k2]!, wy = w[k2]!
        if (y === u || neighbourOf[y] !== u || !(wy > 0)) continue
        // Marks y's direct edges as beaten.
        if (wx + wy <= direct[y]!) direct[y] = -1
      }
    }
    for (let k = s; k < e; k++) {
      const v = g.targets[k]!
      if (w[k]! !== Infinity && direct[v]! >= 0 && w[k]! <= direct[v]!) { keep[k] = 1; kept++ }
    }
  }
  // On shared memory, so worker threads search the same arrays without a copy.
  const offsets = new Uint32Array(new SharedArrayBuffer(4 * (n + 1)))
  const targets = new Uint32Array(new SharedArrayBuffer(4 * kept)), cost = new Float64Array(new SharedArrayBuffer(8 * kept))
  let at = 0
  for (let u = 0; u < n; u++) {
    for (let k = g.offsets[u]!, end = g.offsets[u + 1]!; k < end; k++) {
      if (!keep[k]) continue
      targets[at] = g.targets[k]!; cost[at] = w[k]!; at++
    }
    offsets[u + 1] = at
  }
  return { nodeCount: n, offsets, targets, cost, keptEdges: kept, allEdges: E }
}

/** One row's graph paths: for each later place, the path from the origin's root node to its best settled joining node; null when none is reached, empty when the place is not wanted. */
export type RowPaths = (Int32Array | null)[]

/** The joining nodes of one place and their costs (Seed[] as flat arrays, as a worker receives them). */
export interface FlatSeeds { nodes: number[], costs: number[] }

export interface TableKernel {
  row(sources: FlatSeeds, targets: (FlatSeeds | null)[]): RowPaths
}

/**
 * Dijkstra over a table graph with an indexed binary heap, from the seeds until every wanted node
 * is settled (or all the reachable ones are), and the paths of one row read off the tree. Written
 * without imports or outer names, so a worker thread can run it from its source (tableWorkers.ts).
 */
export function tableKernel(offsets: Uint32Array, targets: Uint32Array, cost: Float64Array, n: number): TableKernel {
  const dist = new Float64Array(n), pred = new Int32Array(n), heap = new Uint32Array(n), pos = new Int32Array(n), mark = new Uint32Array(n)
  // pos[v]: -2 never queued in this search, -1 settled, else its place in the heap.
  let gen = 0
  let size = 0
  function up(i: number, v: number, d: number) {
    while (i > 0) {
      const p = (i - 1) >> 1, pv = heap[p]!
      if (dist[pv]! <= d) break
      heap[i] = pv; pos[pv] = i; i = p
    }
    heap[i] = v; pos[v] = i
  }
  function search(sources: FlatSeeds, wanted: (FlatSeeds | null)[]) {
    const g = ++gen
    dist.fill(Infinity)
    pos.fill(-2)
    size = 0
    let remaining = 0
    for (const t of wanted) if (t) for (const v of t.nodes) if (mark[v] !== g) { mark[v] = g; remaining++ }
    for (let s = 0; s < sources.nodes.length; s++) {
      const v = sources.nodes[s]!, c = sources.costs[s]!
      if (!(c < dist[v]!)) continue
      dist[v] = c; pred[v] = -1
      up(pos[v] === -2 ? size++ : pos[v]!, v, c)
    }
    while (size > 0 && remaining > 0) {
      const u = heap[0]!
      const du = dist[u]!
      pos[u] = -1
      const last = heap[--size]!
      if (size > 0) {
        const dl = dist[last]!
        let i = 0
        for (;;) {
          const l = 2 * i + 1
          if (l >= size) break
          let c = l, dc = dist[heap[l]!]!
          if (l + 1 < size) { const dr = dist[heap[l + 1]!]!; if (dr < dc) { c = l + 1; dc = dr } }
          if (dc >= dl) break
          const cv = heap[c]!
          heap[i] = cv; pos[cv] = i; i = c
        }
        heap[i] = last; pos[last] = i
      }
      if (mark[u] === g) remaining--
      for (let k = offsets[u]!, end = offsets[u + 1]!; k < end; k++) {
        const v = targets[k]!
        const nv = du + cost[k]!
        // Costs are ≥ 0, so a settled node never passes this test.
        if (nv < dist[v]!) {
          dist[v] = nv; pred[v] = u
          const p = pos[v]!
          up(p === -2 ? size++ : p, v, nv)
        }
      }
    }
  }
  return {
    row(sources, wanted) {
      search(sources, wanted)
      return wanted.map((t) => {
        if (!t) return new Int32Array(0)
        let best = Infinity, bestNode = -1
        for (let s = 0; s < t.nodes.length; s++) {
          const v = t.nodes[s]!
          if (pos[v] !== -1) continue
          const c = dist[v]! + t.costs[s]!
          if (c < best) { best = c; bestNode = v }
        }
        if (bestNode < 0) return null
        let length = 0
        for (let v = bestNode; v >= 0; v = pred[v]!) length++
        const path = new Int32Array(length)
        for (let v = bestNode, k = length - 1; v >= 0; v = pred[v]!, k--) path[k] = v
        return path
      })
    },
  }
}
