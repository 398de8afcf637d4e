// Builds the sea router's graph into its cache file (.data/routing, or PW_ROUTING_CACHE_DIR) unless
// a file built from the same inputs is there. Run by `npm start` and `npm test` before the build.
import { existsSync, readdirSync, rmSync } from 'node:fs'
import { basename, dirname, join } from 'node:path'
import { ensureSeaGraphFile, seaGraphFile } from '../server/utils/routing/graphStore'

const file = seaGraphFile()
if (existsSync(file)) console.log(`sea graph: ${file} is current`)
else {
  const started = performance.now()
  await ensureSeaGraphFile()
  console.log(`sea graph: built ${file} in ${((performance.now() - started) / 1000).toFixed(1)} s`)
}
// Graph files built from other inputs are of no further use.
for (const name of readdirSync(dirname(file))) {
  if (name.startsWith('sea-graph-') && name !== basename(file)) rmSync(join(dirname(file), name), { force: true })
}
