// Distance to land on a fine lon/lat raster (1/32°), by a two-pass 5×5 chamfer distance transform
// (Borgefors, "Distance transformations in digital images", CVGIP 34, 1986) with the true local
// lengths of each move (the east–west step shrinks with cos φ), over a land mask filled by scanline
// parity from the routing coastline. Used to place graph nodes and to bound clearance cheaply.
import type { LandData } from '../land'

export const FIELD_PER_DEG = 32
export const FIELD_LAT_MIN = -78
export const FIELD_LAT_MAX = 84
const COLS = 360 * FIELD_PER_DEG
const ROWS = (FIELD_LAT_MAX - FIELD_LAT_MIN) * FIELD_PER_DEG
/** Columns repeated from the other side of the 180° meridian so distances are right across it (≥ 64 nm at 84°). */
const PAD = 11 * FIELD_PER_DEG
const WIDTH = COLS + 2 * PAD
/** Stored distances are in units of 1/50 nm, saturating. */
const UNIT = 50
const MAX = 65535
const STEP_NM = 60 / FIELD_PER_DEG
const RAD = Math.PI / 180

export interface DistanceField {
  /** Chamfer distance (1/50 nm) from each cell centre to the nearest land or coast cell centre; rows × cols, row 0 southernmost. */
  units: Uint16Array
  rows: number
  cols: number
}

const rowLat = (j: number) => FIELD_LAT_MIN + (j + 0.5) / FIELD_PER_DEG

/** Land cells by even-odd parity of cell centres along each row; cells touched by the coastline also count as land. */
function landMask(d: LandData): Uint8Array {
  const mask = new Uint8Array(ROWS * COLS)
  for (let j = 0; j < ROWS; j++) {
    const y = rowLat(j)
    const xs: number[] = []
    for (const e of d.edgeIndex.search(-1e4, y, 1e4, y)) {
      const x1 = d.edges[4 * e]!, y1 = d.edges[4 * e + 1]!, x2 = d.edges[4 * e + 2]!, y2 = d.edges[4 * e + 3]!
      if ((y1 > y) !== (y2 > y)) xs.push(x1 + ((y - y1) * (x2 - x1)) / (y2 - y1))
    }
    xs.sort((a, b) => a - b)
    let passed = 0
    for (let i = 0; i < COLS; i++) {
      const x = -180 + (i + 0.5) / FIELD_PER_DEG
      while (passed < xs.length && xs[passed]! < x) passed++
      if (passed % 2) mask[j * COLS + i] = 1
    }
  }
  const edgeCount = d.edges.length / 4
  for (let e = 0; e < edgeCount; e++) {
    if (d.artificial[e]) continue
    const x1 = d.edges[4 * e]!, y1 = d.edges[4 * e + 1]!, x2 = d.edges[4 * e + 2]!, y2 = d.edges[4 * e + 3]!
    const steps = Math.max(1, Math.ceil(Math.hypot(x2 - x1, y2 - y1) * FIELD_PER_DEG * 4))
    for (let k = 0; k <= steps; k++) {
      const x = x1 + ((x2 - x1) * k) / steps, y = y1 + ((y2 - y1) * k) / steps
      const j = Math.floor((y - FIELD_LAT_MIN) * FIELD_PER_DEG)
      const i = ((Math.floor((x + 180) * FIELD_PER_DEG) % COLS) + COLS) % COLS
      if (j >= 0 && j < ROWS) mask[j * COLS + i] = 1
    }
  }
  return mask
}

/** Two raster passes of the 5×5 chamfer mask with per-row move lengths (the metric of the cell's latitude band). */
function chamfer(work: Float32Array): void {
  const dy = STEP_NM
  const pass = (forward: boolean) => {
    const s = forward ? 1 : -1
    for (let jj = 0; jj < ROWS; jj++) {
      const j = forward ? jj : ROWS - 1 - jj
      const dx = STEP_NM * Math.cos(((rowLat(j) + rowLat(j - s)) / 2) * RAD)
      const dx0 = STEP_NM * Math.cos(rowLat(j) * RAD)
      const dx2 = STEP_NM * Math.cos(((rowLat(j) + rowLat(j - 2 * s)) / 2) * RAD)
      const diag = Math.hypot(dx, dy), k21 = Math.hypot(2 * dx, dy), k12 = Math.hypot(dx2, 2 * dy)
      const row = j * WIDTH, prev = (j - s) * WIDTH, prev2 = (j - 2 * s) * WIDTH
      const hasPrev = j - s >= 0 && j - s < ROWS, hasPrev2 = j - 2 * s >= 0 && j - 2 * s < ROWS
      for (let ii = 2; ii < WIDTH - 2; ii++) {
        const i = forward ? ii : WIDTH - 1 - ii
        let v = work[row + i]!
        if (v === 0) continue
        const a = work[row + i - s]! + dx0
        if (a < v) v = a
        if (hasPrev) {
          const b = work[prev + i]! + dy, c = work[prev + i - 1]! + diag, e = work[prev + i + 1]! + diag
          const f = work[prev + i - 2]! + k21, g = work[prev + i + 2]! + k21
          v = Math.min(v, b, c, e, f, g)
        }
        if (hasPrev2) v = Math.min(v, work[prev2 + i - 1]! + k12, work[prev2 + i + 1]! + k12)
        work[row + i] = v
      }
    }
  }
  pass(true)
  pass(false)
}

export function buildDistanceField(d: LandData): DistanceField {
  const mask = landMask(d)
  const work = new Float32Array(ROWS * WIDTH).fill(1e9)
  for (let j = 0; j < ROWS; j++) {
    for (let i = 0; i < WIDTH; i++) {
      const src = (((i - PAD) % COLS) + COLS) % COLS
      if (mask[j * COLS + src]) work[j * WIDTH + i] = 0
    }
  }
  chamfer(work)
  const units = new Uint16Array(ROWS * COLS)
  for (let j = 0; j < ROWS; j++) {
    for (let i = 0; i < COLS; i++) units[j * COLS + i] = Math.min(MAX, Math.round(work[j * WIDTH + i + PAD]! * UNIT))
  }
  return { units, rows: ROWS, cols: COLS }
}

/** Chamfer distance (nm) at the cell holding a point; Infinity outside the field's latitudes. */
export function fieldNm(f: DistanceField, lat: number, lon: number): number {
  const j = Math.floor((lat - FIELD_LAT_MIN) * FIELD_PER_DEG)
  if (j < 0 || j >= f.rows) return Infinity
  const i = ((Math.floor((lon + 180) * FIELD_PER_DEG) % f.cols) + f.cols) % f.cols
  return f.units[j * f.cols + i]! / UNIT
}

/** Half the diagonal of a field cell at a latitude, nm: how far a point may lie from its cell's centre. */
export function fieldHalfDiagonalNm(lat: number): number {
  return (STEP_NM / 2) * Math.hypot(1, Math.cos(lat * RAD))
}
