import { describe, expect, it } from 'vitest'
import { solverVertex } from '../../shared/utils/solver'

describe('the quick solver\'s vertex question', () => {
  it('has no track, so no vertex, between two identical positions', () => {
    expect(solverVertex({ lat: 10, lon: 10 }, { lat: 10, lon: 10 }).kind).toBe('same')
  })

  it('has no vertex along the equator: every point is at 0° (geodesic (0,0)→(0,179) runs at 090°, GeographicLib tests)', () => {
    expect(solverVertex({ lat: 0, lon: 0 }, { lat: 0, lon: 10 }).kind).toBe('equator')
    expect(solverVertex({ lat: 0, lon: 0 }, { lat: 0, lon: 179 }).kind).toBe('equator')
    expect(solverVertex({ lat: 0, lon: 30 }, { lat: 0, lon: -20 }).kind).toBe('equator')
  })

  it('leaves the equator when the ends are nearly antipodal ((0,0)→(0,179.5) starts at 055.97°, GeographicLib tests)', () => {
    const answer = solverVertex({ lat: 0, lon: 0 }, { lat: 0, lon: 179.5 })
    expect(answer.kind).toBe('vertex')
  })

  it('gives the vertex of an ordinary ocean leg: JFK → Singapore crosses the Arctic (GeodSolve manual: α1 003°18′29.9″)', () => {
    const answer = solverVertex({ lat: 40 + 38 / 60 + 23 / 3600, lon: -(73 + 46 / 60 + 44 / 3600) }, { lat: 1 + 21 / 60 + 33 / 3600, lon: 103 + 59 / 60 + 22 / 3600 })
    expect(answer.kind).toBe('vertex')
    if (answer.kind !== 'vertex') return
    expect(answer.vertex.between).toBe(true)
    // Clairaut, sphere-level check (common practice): cos φv ≈ sin α1 · cos φ1 = sin(3.308°)·cos(40.64°) → φv ≈ 87.5°
    expect(answer.vertex.lat).toBeGreaterThan(87)
    expect(answer.vertex.lat).toBeLessThan(88)
  })
})
