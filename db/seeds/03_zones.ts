// Demo zones: the ECAs as the trade knows them (approximate outlines, ecaZones.ts) for both demo
// companies, and the Kestrel Bight company's own areas (invented rules at real places).
import type { Knex } from 'knex'
import { ecaZones, type SeedZone } from './ecaZones'

type Ring = [number, number][]

/** A ring of n vertices round a centre (small-circle approximation, good to a few metres at these sizes). */
function around(lat: number, lon: number, radiusNm: number, n = 24): Ring {
  const ring: Ring = []
  for (let i = 0; i < n; i++) {
    const a = 2 * Math.PI * i / n
    ring.push([+(lon + radiusNm / 60 * Math.sin(a) / Math.cos(lat * Math.PI / 180)).toFixed(4), +(lat + radiusNm / 60 * Math.cos(a)).toFixed(4)])
  }
  ring.push([...ring[0]!] as [number, number])
  return ring
}

const companyAreas: (Omit<SeedZone, 'kind'> & { kind: 'no-go' | 'risk' | 'custom' })[] = [
  {
    name: 'Sable Island Bank (keep 25 nm off)', kind: 'no-go', validFrom: null,
    source: 'Company standing order: keep 25 nm off Sable Island (43°57′N 59°55′W) and its shoals',
    polygons: [[around(43.95, -59.92, 25)]],
  },
  {
    name: 'Gulf of Aden and Somali Basin', kind: 'risk', validFrom: null,
    source: 'Company risk area for war-risk cover and security measures (drawn by the shore office)',
    polygons: [[[[43.5, 13.5], [48.0, 14.8], [52.0, 16.0], [60.0, 16.0], [60.0, 0.0], [49.0, -2.0], [41.5, -2.0], [43.0, 11.0], [43.5, 13.5]]]],
  },
]

const row = (companyId: number, z: { name: string, kind: string, source: string, validFrom: string | null, polygons: SeedZone['polygons'] }, approximate: boolean) => ({
  company_id: companyId, kind: z.kind, name: z.name, source: z.source, approximate, valid_from: z.validFrom, valid_to: null,
  geometry: JSON.stringify({ type: 'MultiPolygon', coordinates: z.polygons }), vertex_count: z.polygons.flat(2).length,
})

export async function seed(knex: Knex) {
  await knex('zones').delete()
  const companies = await knex('companies').orderBy('id').select('id', 'name')
  const kestrel = companies.find(c => c.name === 'Kestrel Bight Shipping')
  for (const c of companies) await knex('zones').insert(ecaZones.map(z => row(c.id, z, true)))
  if (kestrel) await knex('zones').insert(companyAreas.map(z => row(kestrel.id, z, false)))
}
