// One sea graph per process: read from the cache file (built by `scripts/routing-graph.ts` in the
// bootstrap, keyed by a hash of its inputs), or built on first use and cached for the next process.
import { existsSync } from 'node:fs'
import { join, resolve } from 'node:path'
import { DEFAULT_GRAPH_PARAMS } from './graphBuild'
import { graphKey, readGraphFile, writeGraphFile } from './graphFile'
import { buildRoutingLand } from './coast'
import { buildSeaGraphArrays, seaGraphFrom } from './seaGraph'
import type { SeaGraph } from './seaGraph'

let graph: Promise<SeaGraph> | undefined

export function seaGraphFile(): string {
  const dir = process.env.PW_ROUTING_CACHE_DIR || resolve('.data/routing')
  return join(dir, `sea-graph-${graphKey(DEFAULT_GRAPH_PARAMS)}.bin`)
}

/** Builds the graph file unless it is there (about 15 s); returns its path. */
export async function ensureSeaGraphFile(): Promise<string> {
  const file = seaGraphFile()
  if (!existsSync(file)) {
    const land = await buildRoutingLand()
    writeGraphFile(file, { arrays: buildSeaGraphArrays(land, DEFAULT_GRAPH_PARAMS), land })
  }
  return file
}

/** The process's sea graph, read once (about 0.5 s) from the cache file. */
export function useSeaGraph(): Promise<SeaGraph> {
  if (!graph) {
    graph = ensureSeaGraphFile().then((file) => {
      const { arrays, land } = readGraphFile(file)
      return seaGraphFrom(arrays, land)
    })
    graph.catch(() => { graph = undefined })
  }
  return graph
}
