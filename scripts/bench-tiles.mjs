// Tile benchmark against a running server (BENCH_URL, default http://127.0.0.1:3000):
// 1. cold tiles: first requests for zoom-8 tiles not yet rendered (server-side render + PNG encode);
// 2. a cached tile against a static file from public/ served by the same server, under load
//    with autocannon; the goal is a cached tile at ≥ 0.8× the static file's requests per second.
// Usage: node scripts/bench-tiles.mjs [--seconds 10] [--connections 20]; BENCH_STATIC=/_nuxt/<file> compares
// against a static file of about a coast tile's size instead of /favicon.svg.
import autocannon from 'autocannon'

const base = (process.env.BENCH_URL || 'http://127.0.0.1:3000').replace(/\/$/, '')
const arg = (name, fallback) => {
  const i = process.argv.indexOf(`--${name}`)
  return i > 0 ? Number(process.argv[i + 1]) : fallback
}
const seconds = arg('seconds', 10)
const connections = arg('connections', 20)

async function timed(path) {
  const t = performance.now()
  const res = await fetch(base + path)
  const body = Buffer.from(await res.arrayBuffer())
  if (res.status !== 200) throw new Error(`${path}: HTTP ${res.status}`)
  return { ms: performance.now() - t, bytes: body.length }
}

function median(xs) {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

async function load(path) {
  const result = await autocannon({ url: base + path, connections, duration: seconds })
  if (result.non2xx) throw new Error(`${path}: ${result.non2xx} responses were not 2xx`)
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99 }
}

// Tiles picked at random so a fresh server (or a fresh cache folder) has not drawn them yet;
// a tile already on disk answers as fast as a warm one, so "cold" is an upper bound of that.
const cold = []
for (let i = 0; i < 20; i++) {
  const x = Math.floor(Math.random() * 256), y = Math.floor(Math.random() * 256)
  cold.push((await timed(`/tiles/8/${x}/${y}.png`)).ms)
}
const warmPath = '/tiles/3/4/2.png'
await timed(warmPath)
const warm = []
for (let i = 0; i < 50; i++) warm.push((await timed(warmPath)).ms)

console.log(`cold zoom-8 tiles: median ${median(cold).toFixed(1)} ms, max ${Math.max(...cold).toFixed(1)} ms (20 tiles)`)
console.log(`warm tile ${warmPath}: median ${median(warm).toFixed(2)} ms (50 requests, one at a time)`)

// A coast tile (about 20 kB) and an open-sea tile (about 1 kB): on loopback the body size, not
// the handler, sets the rate, so both are reported against the same static file.
const staticPath = process.env.BENCH_STATIC || '/favicon.svg'
const staticFile = await load(staticPath)
console.log(`static ${staticPath}: ${staticFile.rps.toFixed(0)} req/s, p50 ${staticFile.p50} ms, p99 ${staticFile.p99} ms`)
for (const path of [warmPath, '/tiles/8/10/10.png']) {
  const { bytes } = await timed(path)
  const tile = await load(path)
  const ratio = tile.rps / staticFile.rps
  console.log(`cached ${path} (${bytes} B): ${tile.rps.toFixed(0)} req/s, p50 ${tile.p50} ms, p99 ${tile.p99} ms, ratio ${ratio.toFixed(2)} (goal ≥ 0.80: ${ratio >= 0.8 ? 'met' : 'not met'})`)
}
