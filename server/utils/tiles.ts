// Chart tiles drawn by the app from the same Natural Earth 1:50m land as the land check:
// Web Mercator (EPSG:3857), 256 px, zoom 0–8, cached in memory (LRU by bytes) and on disk.
import { createHash } from 'node:crypto'
import { mkdir, readFile, rename, writeFile } from 'node:fs/promises'
import { join } from 'node:path'
import { createCanvas, Path2D } from '@napi-rs/canvas'
import type { SKRSContext2D } from '@napi-rs/canvas'
import { landData } from './land'
import type { LandData } from './land'

export const TILE_SIZE = 256
export const MAX_TILE_ZOOM = 8
/** Bump when the drawing changes: it names the disk cache folder, so old tiles are never served. */
export const TILE_STYLE = 'v1'

/** Passagewright chart palette. */
export const TILE_COLOURS = {
  sea: '#dfe9ec',
  land: '#efe6d2',
  coast: '#b9a67f',
  graticule: 'rgba(59, 121, 118, 0.28)',
  graticuleMajor: 'rgba(59, 121, 118, 0.5)',
} as const

const MAX_MERCATOR_LAT = 85.0511287798066

export interface TileAddress { z: number, x: number, y: number }
export interface Tile { png: Buffer, etag: string }

/** Parses route parameters ("3", "4", "5.png"); undefined unless a tile of zoom 0–8 addressed as in /tiles/z/x/y.png. */
export function parseTileAddress(z: unknown, x: unknown, yPng: unknown): TileAddress | undefined {
  const y = typeof yPng === 'string' && yPng.endsWith('.png') ? yPng.slice(0, -4) : undefined
  const [tz, tx, ty] = [z, x, y].map(v => (typeof v === 'string' && /^(0|[1-9]\d{0,2})$/.test(v) ? Number(v) : Number.NaN)) as [number, number, number]
  if (!(tz >= 0 && tz <= MAX_TILE_ZOOM)) return undefined
  const n = 2 ** tz
  if (!(tx >= 0 && tx < n && ty >= 0 && ty < n)) return undefined
  return { z: tz, x: tx, y: ty }
}

/** Web Mercator world pixel x of a longitude at zoom z (EPSG:3857, spherical). */
export function lonToWorldPx(lon: number, z: number): number {
  return ((lon + 180) / 360) * TILE_SIZE * 2 ** z
}

/** Web Mercator world pixel y of a latitude at zoom z: y = (1 − ln(tan(π/4 + φ/2))/π)/2. */
export function latToWorldPx(lat: number, z: number): number {
  const phi = (Math.max(-MAX_MERCATOR_LAT, Math.min(MAX_MERCATOR_LAT, lat)) * Math.PI) / 180
  return ((1 - Math.log(Math.tan(Math.PI / 4 + phi / 2)) / Math.PI) / 2) * TILE_SIZE * 2 ** z
}

function worldPxToLat(py: number, z: number): number {
  const n = Math.PI - (2 * Math.PI * py) / (TILE_SIZE * 2 ** z)
  return (Math.atan(Math.sinh(n)) * 180) / Math.PI
}

/** Lon/lat box of a tile, widened by a margin in pixels. */
function tileBounds({ z, x, y }: TileAddress, marginPx: number) {
  const degPerPx = 360 / (TILE_SIZE * 2 ** z)
  return {
    west: -180 + x * TILE_SIZE * degPerPx - marginPx * degPerPx,
    east: -180 + (x + 1) * TILE_SIZE * degPerPx + marginPx * degPerPx,
    north: worldPxToLat(y * TILE_SIZE - marginPx, z),
    south: worldPxToLat((y + 1) * TILE_SIZE + marginPx, z),
  }
}

const CLIP_MIN = -4
const CLIP_MAX = TILE_SIZE + 4

/** One Sutherland–Hodgman pass: keeps the part of a closed ring where sign·coord ≤ limit. */
function clipPass(xy: number[], axis: 0 | 1, limit: number, sign: 1 | -1): number[] {
  const out: number[] = []
  const n = xy.length / 2
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n
    const a = sign * xy[2 * i + axis]!, b = sign * xy[2 * j + axis]!
    if (a <= limit) out.push(xy[2 * i]!, xy[2 * i + 1]!)
    if ((a <= limit) !== (b <= limit)) {
      const t = (limit - a) / (b - a)
      out.push(xy[2 * i]! + t * (xy[2 * j]! - xy[2 * i]!), xy[2 * i + 1]! + t * (xy[2 * j + 1]! - xy[2 * i + 1]!))
    }
  }
  return out
}

function clipToTile(xy: number[]): number[] {
  let out = xy
  for (const [axis, limit, sign] of [[0, CLIP_MAX, 1], [0, -CLIP_MIN, -1], [1, CLIP_MAX, 1], [1, -CLIP_MIN, -1]] as const) {
    out = clipPass(out, axis, limit, sign)
    if (out.length === 0) break
  }
  return out
}

function svgRing(xy: number[], close: boolean): string {
  let d = `M${xy[0]!.toFixed(2)} ${xy[1]!.toFixed(2)}`
  for (let i = 2; i < xy.length; i += 2) d += `L${xy[i]!.toFixed(2)} ${xy[i + 1]!.toFixed(2)}`
  return close ? `${d}Z` : d
}

function outside(ax: number, ay: number, bx: number, by: number): boolean {
  return (ax < CLIP_MIN && bx < CLIP_MIN) || (ax > CLIP_MAX && bx > CLIP_MAX) || (ay < CLIP_MIN && by < CLIP_MIN) || (ay > CLIP_MAX && by > CLIP_MAX)
}

/**
 * Ring r in tile pixels: its outline with vertices closer than half a pixel dropped, and its coast
 * lines (edges on the tile, without the 180° cut and the closure over the pole).
 */
function ringInTile(land: LandData, r: number, t: TileAddress): { outline: number[], coast: number[][] } {
  const ring = land.rings[r]!
  const ox = t.x * TILE_SIZE, oy = t.y * TILE_SIZE
  const outline: number[] = []
  const coast: number[][] = []
  let line: number[] = []
  let lx = Number.NaN, ly = Number.NaN
  for (let k = 0; k < ring.length / 2; k++) {
    const px = lonToWorldPx(ring[2 * k]!, t.z) - ox, py = latToWorldPx(ring[2 * k + 1]!, t.z) - oy
    const cut = k > 0 && land.artificial[land.ringEdge[r]! + k - 1] === 1
    if (k > 0 && !cut && k < ring.length / 2 - 1 && Math.abs(px - lx) < 0.5 && Math.abs(py - ly) < 0.5) continue
    outline.push(px, py)
    if (k > 0 && !cut && !outside(lx, ly, px, py)) {
      if (line.length === 0) line.push(lx, ly)
      line.push(px, py)
    }
    else if (line.length > 0) {
      coast.push(line)
      line = []
    }
    lx = px; ly = py
  }
  if (line.length > 2) coast.push(line)
  return { outline, coast }
}

/** Land fill and coast line of the rings that touch the tile, as one path each. */
function drawLand(ctx: SKRSContext2D, land: LandData, t: TileAddress): void {
  const b = tileBounds(t, 4)
  let fill = ''
  let stroke = ''
  for (const r of land.ringIndex.search(b.west, b.south, b.east, b.north)) {
    const { outline, coast } = ringInTile(land, r, t)
    const clipped = clipToTile(outline)
    if (clipped.length >= 6) fill += svgRing(clipped, true)
    for (const line of coast) stroke += svgRing(line, false)
  }
  if (fill) {
    ctx.fillStyle = TILE_COLOURS.land
    ctx.fill(new Path2D(fill), 'evenodd')
  }
  if (stroke) {
    ctx.strokeStyle = TILE_COLOURS.coast
    ctx.lineWidth = t.z < 3 ? 0.6 : t.z < 6 ? 0.8 : 1
    ctx.lineJoin = 'round'
    ctx.stroke(new Path2D(stroke))
  }
}

/** Graticule spacing in degrees for a zoom, and every how many lines one is drawn stronger. */
export function graticuleStep(z: number): { step: number, major: number } {
  if (z <= 1) return { step: 30, major: 3 }
  if (z <= 3) return { step: 10, major: 3 }
  if (z <= 5) return { step: 5, major: 2 }
  return { step: 1, major: 5 }
}

function drawGraticule(ctx: SKRSContext2D, t: TileAddress): void {
  const { step, major } = graticuleStep(t.z)
  const b = tileBounds(t, 0)
  const ox = t.x * TILE_SIZE, oy = t.y * TILE_SIZE
  const lines: { major: boolean, x1: number, y1: number, x2: number, y2: number }[] = []
  for (let lon = Math.ceil(b.west / step) * step; lon < b.east; lon += step) {
    const px = Math.floor(lonToWorldPx(lon, t.z) - ox) + 0.5
    lines.push({ major: Math.round(lon / step) % major === 0, x1: px, y1: 0, x2: px, y2: TILE_SIZE })
  }
  for (let lat = Math.ceil(b.south / step) * step; lat < b.north; lat += step) {
    const py = Math.floor(latToWorldPx(lat, t.z) - oy) + 0.5
    lines.push({ major: Math.round(lat / step) % major === 0, x1: 0, y1: py, x2: TILE_SIZE, y2: py })
  }
  for (const isMajor of [false, true]) {
    ctx.beginPath()
    for (const l of lines.filter(l => l.major === isMajor)) { ctx.moveTo(l.x1, l.y1); ctx.lineTo(l.x2, l.y2) }
    ctx.strokeStyle = isMajor ? TILE_COLOURS.graticuleMajor : TILE_COLOURS.graticule
    ctx.lineWidth = 0.75
    ctx.stroke()
  }
}

/** Renders one tile to PNG bytes (no cache). */
export async function renderTile(t: TileAddress): Promise<Buffer> {
  const canvas = createCanvas(TILE_SIZE, TILE_SIZE)
  const ctx = canvas.getContext('2d')
  ctx.fillStyle = TILE_COLOURS.sea
  ctx.fillRect(0, 0, TILE_SIZE, TILE_SIZE)
  drawLand(ctx, landData(), t)
  drawGraticule(ctx, t)
  return canvas.encode('png')
}

function etagOf(png: Buffer): string {
  return `"${createHash('sha1').update(png).digest('base64url').slice(0, 22)}"`
}

const MEMORY_LIMIT_BYTES = 64 * 1024 * 1024
const memory = new Map<string, Tile>()
let memoryBytes = 0
const pending = new Map<string, Promise<Tile>>()

function remember(key: string, tile: Tile): void {
  memory.set(key, tile)
  memoryBytes += tile.png.length
  for (const [k, old] of memory) {
    if (memoryBytes <= MEMORY_LIMIT_BYTES) break
    memory.delete(k)
    memoryBytes -= old.png.length
  }
}

async function loadOrRender(t: TileAddress, cacheDir: string | undefined): Promise<Tile> {
  const file = cacheDir ? join(cacheDir, TILE_STYLE, String(t.z), String(t.x), `${t.y}.png`) : undefined
  if (file) {
    const stored = await readFile(file).catch(() => undefined)
    if (stored) return { png: stored, etag: etagOf(stored) }
  }
  const png = await renderTile(t)
  if (file) {
    // Write then rename, so a reader (or another server on the same disk) never sees half a file.
    const tmp = `${file}.${process.pid}.${Date.now()}.tmp`
    await mkdir(join(file, '..'), { recursive: true })
      .then(() => writeFile(tmp, png))
      .then(() => rename(tmp, file))
      .catch(err => console.warn(`tile cache: could not write ${file}: ${err.message}`))
  }
  return { png, etag: etagOf(png) }
}

/** A tile from memory, else from the disk cache, else freshly rendered (and stored in both). */
export async function getTile(t: TileAddress, cacheDir?: string): Promise<Tile> {
  const key = `${t.z}/${t.x}/${t.y}`
  const hit = memory.get(key)
  if (hit) {
    memory.delete(key) // re-insert: Map order is the LRU order
    memory.set(key, hit)
    return hit
  }
  let job = pending.get(key)
  if (!job) {
    job = loadOrRender(t, cacheDir).finally(() => pending.delete(key))
    pending.set(key, job)
  }
  const tile = await job
  if (!memory.has(key)) remember(key, tile)
  return tile
}

