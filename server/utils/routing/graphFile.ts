// The sea graph's cache file: named typed-array sections behind a small JSON header, read back as
// views on one buffer (no copies). The file name carries a hash of what the graph is built from.
import { createHash } from 'node:crypto'
import { closeSync, mkdirSync, openSync, readFileSync, renameSync, writeSync } from 'node:fs'
import { dirname } from 'node:path'
import Flatbush from 'flatbush'
import { PASSAGES } from '#shared/utils/routing/passages'
import type { LandData } from '../land'
import type { GraphParams } from './graphBuild'
import type { GraphArrays } from './seaGraph'

/** Bump when the builder's output changes for the same inputs. */
export const GRAPH_FORMAT = 'passagewright-sea-graph-3'
const MAGIC = 'PWSG'

type Typed = Float64Array | Float32Array | Uint32Array | Uint8Array
const TYPES = { Float64Array, Float32Array, Uint32Array, Uint8Array } as const
type TypeName = keyof typeof TYPES

export function graphKey(params: GraphParams): string {
  const inputs = JSON.stringify({ GRAPH_FORMAT, params, PASSAGES, coastline: 'world-atlas 2.0.2 land-10m' })
  return createHash('sha256').update(inputs).digest('hex').slice(0, 16)
}

interface Section { name: string, type: TypeName, offset: number, length: number }

export interface StoredGraph { arrays: GraphArrays, land: LandData }

function sectionsOf(s: StoredGraph): [string, Typed][] {
  const a = s.arrays
  const gateOffsets = new Uint32Array(a.gateEdges.length + 1)
  a.gateEdges.forEach((g, i) => { gateOffsets[i + 1] = gateOffsets[i]! + g.length })
  const gates = new Uint32Array(gateOffsets[a.gateEdges.length]!)
  a.gateEdges.forEach((g, i) => gates.set(g, gateOffsets[i]!))
  return [
    ['lat', a.lat], ['lon', a.lon], ['clearNm', a.clearNm], ['nodePassage', a.nodePassage],
    ['offsets', a.offsets], ['targets', a.targets], ['lengthNm', a.lengthNm], ['edgeClearNm', a.edgeClearNm], ['passage', a.passage],
    ['gateOffsets', gateOffsets], ['gates', gates], ['landmarks', a.landmarks], ['landmarkNm', a.landmarkNm],
    ['raster', a.raster.lowerBound],
    ['landEdges', s.land.edges], ['landArtificial', s.land.artificial], ['landCorners', s.land.corners],
    ['landIndex', new Uint8Array(s.land.edgeIndex.data as ArrayBuffer)],
  ]
}

export function writeGraphFile(file: string, s: StoredGraph): void {
  const sections = sectionsOf(s)
  const table: Section[] = []
  let at = 0
  for (const [name, arr] of sections) {
    table.push({ name, type: arr.constructor.name as TypeName, offset: at, length: arr.length })
    at += Math.ceil(arr.byteLength / 8) * 8
  }
  const header = Buffer.from(JSON.stringify({ sections: table, rasterRows: s.arrays.raster.rows, rasterCols: s.arrays.raster.cols }))
  const headLen = Math.ceil((12 + header.length) / 8) * 8
  const head = Buffer.alloc(headLen)
  head.write(MAGIC, 0, 'latin1')
  head.writeUInt32LE(header.length, 4)
  header.copy(head, 12)
  mkdirSync(dirname(file), { recursive: true })
  const tmp = `${file}.${process.pid}.tmp`
  const fd = openSync(tmp, 'w')
  try {
    writeSync(fd, head)
    for (const [, arr] of sections) {
      const bytes = Buffer.from(arr.buffer, arr.byteOffset, arr.byteLength)
      writeSync(fd, bytes)
      const pad = Math.ceil(arr.byteLength / 8) * 8 - arr.byteLength
      if (pad) writeSync(fd, Buffer.alloc(pad))
    }
  }
  finally { closeSync(fd) }
  renameSync(tmp, file)
}

export function readGraphFile(file: string): StoredGraph {
  const buf = readFileSync(file)
  if (buf.toString('latin1', 0, 4) !== MAGIC) throw new Error(`${file} is not a sea graph`)
  const headerLen = buf.readUInt32LE(4)
  const header = JSON.parse(buf.toString('utf8', 12, 12 + headerLen)) as { sections: Section[], rasterRows: number, rasterCols: number }
  const base = buf.byteOffset + Math.ceil((12 + headerLen) / 8) * 8
  // Copy once into an 8-byte-aligned buffer when Node's pooled buffer is not aligned.
  const data = base % 8 === 0 ? buf.buffer : buf.buffer.slice(base, buf.byteOffset + buf.byteLength)
  const origin = base % 8 === 0 ? base : 0
  const get = <T extends Typed>(name: string): T => {
    const s = header.sections.find(x => x.name === name)!
    return new TYPES[s.type](data, origin + s.offset, s.length) as T
  }
  const gateOffsets = get<Uint32Array>('gateOffsets'), gates = get<Uint32Array>('gates')
  const gateEdges = Array.from({ length: gateOffsets.length - 1 }, (_, i) => gates.subarray(gateOffsets[i]!, gateOffsets[i + 1]!))
  const indexBytes = get<Uint8Array>('landIndex')
  const edgeIndex = Flatbush.from(indexBytes.buffer, indexBytes.byteOffset)
  const land: LandData = {
    rings: [], ringEdge: new Uint32Array(0), ringIndex: edgeIndex,
    edges: get('landEdges'), artificial: get('landArtificial'), edgeIndex, corners: get('landCorners'),
  }
  const arrays: GraphArrays = {
    lat: get('lat'), lon: get('lon'), clearNm: get('clearNm'), nodePassage: get('nodePassage'),
    offsets: get('offsets'), targets: get('targets'), lengthNm: get('lengthNm'), edgeClearNm: get('edgeClearNm'), passage: get('passage'),
    gateEdges, landmarks: get('landmarks'), landmarkNm: get('landmarkNm'),
    raster: { lowerBound: get('raster'), rows: header.rasterRows, cols: header.rasterCols },
  }
  return { arrays, land }
}
