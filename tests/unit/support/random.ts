// Seeded pseudo-random numbers so generated cases repeat exactly (mulberry32, T. Ettinger, public domain).
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

export interface Pair { kind: string, lat1: number, lon1: number, lat2: number, lon2: number }

/** Cases of the kinds the accuracy targets name; inputs only (any method may generate them). */
export function generatePairs(seed: number, perKind: number, kinds: readonly string[]): Pair[] {
  const rnd = seededRandom(seed)
  const u = (a: number, b: number) => a + (b - a) * rnd()
  const lat = () => Math.asin(u(-1, 1)) * 180 / Math.PI
  const wrap = (x: number) => ((x + 540) % 360) - 180
  const make: Record<string, () => [number, number, number, number]> = {
    random: () => [lat(), u(-180, 180), lat(), u(-180, 180)],
    short: () => {
      const la = u(-80, 80), lo = u(-180, 180), d = 10 ** u(2, Math.log10(1852)) / 111_000, c = u(0, 2 * Math.PI)
      return [la, lo, la + d * Math.cos(c), wrap(lo + d * Math.sin(c) / Math.cos(la * Math.PI / 180))]
    },
    eastWest: () => { const la = u(-80, 80); return [la, u(-180, 180), la + u(-1, 1) * 10 ** u(-12, -4), u(-180, 180)] },
    cross180: () => [lat() * 0.9, u(170, 180), lat() * 0.9, u(-180, -170)],
    polar: () => { const h = rnd() < 0.5 ? 1 : -1; return [h * u(84, 89.999), u(-180, 180), h * u(84, 89.999), u(-180, 180)] },
    antipodal: () => { const la = lat(), lo = u(-180, 180); return [la, lo, -la + u(-0.5, 0.5), wrap(lo + 180 + u(-0.5, 0.5))] },
    equatorial: () => rnd() < 0.5 ? [0, u(-180, 180), 0, u(-180, 180)] : [u(-1e-6, 1e-6), u(-180, 180), u(-1e-6, 1e-6), u(-180, 180)],
    meridional: () => { const lo = u(-180, 180); return [lat(), lo, lat(), lo] },
  }
  const out: Pair[] = []
  for (const kind of kinds) for (let i = 0; i < perKind; i++) {
    const [lat1, lon1, lat2, lon2] = make[kind]!()
    out.push({ kind, lat1, lon1, lat2: Math.max(-90, Math.min(90, lat2)), lon2 })
  }
  return out
}

export const ALL_KINDS = ['random', 'short', 'eastWest', 'cross180', 'polar', 'antipodal', 'equatorial', 'meridional'] as const
