import { describe, expect, it } from 'vitest'
import { buildRouteSketch } from '~~/composables/useRouteSketch'

// The still chart of the import preview and the print: tile layout and track in one viewBox.
const box = (s: NonNullable<ReturnType<typeof buildRouteSketch>>) => s.vb

describe('route sketch', () => {
  it('draws a North Pacific crossing as one line across 180° with tiles of the right zoom', () => {
    const s = buildRouteSketch([
      { lat: 35.3, lon: 139.8 }, { lat: 47, lon: 170, method: 'geodesic' }, { lat: 48.75, lon: -160, method: 'rhumb' }, { lat: 48.5, lon: -124.8, method: 'geodesic' },
    ], { width: 900, height: 500 })!
    expect(s.zoom).toBeGreaterThanOrEqual(1)
    expect(s.zoom).toBeLessThanOrEqual(8)
    const k = 2 ** s.zoom
    for (const t of s.tiles) {
      const [, z, x, y] = /^\/tiles\/(\d+)\/(\d+)\/(\d+)\.png$/.exec(t.href)!.map(Number)
      expect(z).toBe(s.zoom)
      expect(x).toBeGreaterThanOrEqual(0); expect(x).toBeLessThan(k)
      expect(y).toBeGreaterThanOrEqual(0); expect(y).toBeLessThan(k)
    }
    const linePoints = s.line.split(' ').map(p => p.split(',').map(Number) as [number, number])
    // Densified every 25 nm over some 4,000 nm: well over a hundred points, each inside the view.
    expect(linePoints.length).toBeGreaterThan(100)
    for (const [x, y] of linePoints) {
      expect(x).toBeGreaterThan(box(s).x); expect(x).toBeLessThan(box(s).x + box(s).w)
      expect(y).toBeGreaterThan(box(s).y); expect(y).toBeLessThan(box(s).y + box(s).h)
    }
    const xs = linePoints.map(p => p[0])
    const biggestStep = Math.max(...xs.slice(1).map((x, i) => Math.abs(x - xs[i]!)))
    expect(biggestStep).toBeLessThan(box(s).w / 4) // no jump back across the chart at 180°
    expect(s.points).toHaveLength(4) // one mark per waypoint, so the bounds below check every one
    for (const p of s.points) {
      expect(p.x).toBeGreaterThan(box(s).x); expect(p.x).toBeLessThan(box(s).x + box(s).w)
      expect(p.y).toBeGreaterThan(box(s).y); expect(p.y).toBeLessThan(box(s).y + box(s).h)
    }
    expect(s.labels.some(l => l.text === '180°')).toBe(true)
  })

  it('zooms in on a short coastal route and keeps the picture\'s proportions', () => {
    const s = buildRouteSketch([{ lat: 52.025, lon: 3.883 }, { lat: 51.017, lon: 1.4 }], { width: 900, height: 500 })!
    expect(s.zoom).toBeGreaterThanOrEqual(5)
    expect(box(s).w / box(s).h).toBeCloseTo(900 / 500, 5)
    expect(s.tiles.length).toBeLessThanOrEqual(30)
  })

  it('has nothing to draw for fewer than two waypoints', () => {
    expect(buildRouteSketch([{ lat: 1, lon: 1 }], { width: 900, height: 500 })).toBeNull()
  })
})
