// Chart tiles rendered from Natural Earth 1:50m land (world-atlas 2.0.2), read back pixel by pixel.
import { mkdtemp, readFile, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { loadImage } from '@napi-rs/canvas'
import { getTile, parseTileAddress, renderTile, TILE_COLOURS } from '../../server/utils/tiles'

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]

// Web Mercator (EPSG:3857) written out again here, independent of the code under test:
// world pixel x = (lon + 180) / 360 · 256 · 2^z, y = (1 − ln(tan φ + sec φ) / π) / 2 · 256 · 2^z.
function pixelOf(lat: number, lon: number, z: number) {
  const world = 256 * 2 ** z
  const phi = (lat * Math.PI) / 180
  const wx = ((lon + 180) / 360) * world
  const wy = ((1 - Math.log(Math.tan(phi) + 1 / Math.cos(phi)) / Math.PI) / 2) * world
  return { tile: { z, x: Math.floor(wx / 256), y: Math.floor(wy / 256) }, px: Math.floor(wx % 256), py: Math.floor(wy % 256) }
}

function rgb(hex: string): number[] {
  return [1, 3, 5].map(i => Number.parseInt(hex.slice(i, i + 2), 16))
}

async function colourAt(lat: number, lon: number, z: number): Promise<number[]> {
  const { tile, px, py } = pixelOf(lat, lon, z)
  const image = await loadImage(await renderTile(tile))
  const { createCanvas } = await import('@napi-rs/canvas')
  const canvas = createCanvas(256, 256)
  const ctx = canvas.getContext('2d')
  ctx.drawImage(image, 0, 0)
  return [...ctx.getImageData(px, py, 1, 1).data.slice(0, 3)]
}

describe('chart tiles', () => {
  it('are 256-pixel PNG images', async () => {
    const png = await renderTile({ z: 3, x: 4, y: 3 })
    expect([...png.subarray(0, 8)]).toEqual(PNG_SIGNATURE)
    const image = await loadImage(png)
    expect([image.width, image.height]).toEqual([256, 256])
  })

  // Positions from memory, chosen well inside land or sea and off the graticule lines.
  it.each([
    ['central Sahara (23°N 13°E)', 23, 13, 4],
    ['central Australia near Alice Springs (23.7°S 133.9°E)', -23.7, 133.9, 5],
    ['the Brazilian interior (12°S 52°W)', -12, -52, 3],
    ['Siberia (62.4°N 98.6°E)', 62.4, 98.6, 6],
  ])('draw land in %s', async (_name, lat, lon, z) => {
    expect(await colourAt(lat, lon, z)).toEqual(rgb(TILE_COLOURS.land))
  })

  it.each([
    ['the mid North Atlantic (35.6°N 41.3°W)', 35.6, -41.3, 4],
    ['the South Pacific (31°S 128°W)', -31, -128, 5],
    ['the Indian Ocean (12°S 82°E)', -12, 82, 2],
    ['the Bering Sea west of 180° (57.4°N 176.5°E)', 57.4, 176.5, 6],
  ])('draw sea in %s', async (_name, lat, lon, z) => {
    expect(await colourAt(lat, lon, z)).toEqual(rgb(TILE_COLOURS.sea))
  })

  it('draw Chukotka on both sides of the 180° meridian (66°N 179°E and 66°N 178°W, from memory)', async () => {
    expect(await colourAt(66, 179, 4)).toEqual(rgb(TILE_COLOURS.land))
    expect(await colourAt(66, -178, 4)).toEqual(rgb(TILE_COLOURS.land))
  })

  it('accept only zoom 0–8 and x, y inside the zoom', () => {
    expect(parseTileAddress('3', '7', '5.png')).toEqual({ z: 3, x: 7, y: 5 })
    expect(parseTileAddress('8', '255', '255.png')).toEqual({ z: 8, x: 255, y: 255 })
    expect(parseTileAddress('0', '0', '0.png')).toEqual({ z: 0, x: 0, y: 0 })
    for (const bad of [['9', '0', '0'], ['3', '8', '0'], ['3', '0', '8'], ['-1', '0', '0'], ['a', '0', '0'], ['2', '1.5', '0'], ['2', '1', 'x.png'], ['', '0', '0.png'], ['2', '1', undefined], ['2', '1', '1'], ['2', '1', '1.5.png'], ['2', '1', '1.png.png'], ['2', '01', '1.png']])
      expect(parseTileAddress(bad[0], bad[1], bad[2]), bad.join('/')).toBeUndefined()
  })

  it('are cached on disk and in memory with a stable ETag', async () => {
    const dir = await mkdtemp(join(tmpdir(), 'pw-tiles-'))
    try {
      const first = await getTile({ z: 2, x: 1, y: 1 }, dir)
      const second = await getTile({ z: 2, x: 1, y: 1 }, dir)
      expect(second.etag).toBe(first.etag)
      const onDisk = await readFile(join(dir, 'v1', '2', '1', '1.png'))
      expect(onDisk.equals(first.png)).toBe(true)
    }
    finally { await rm(dir, { recursive: true, force: true }) }
  })
})
