// CSV export of a distance table: the distance matrix, then a matrix of source marks, then a key.
import type { DistanceTableDetail } from '../types/distanceTable'
import { pairIndex } from './distanceTable'
import { LAND_CHECK_CAUTION, PLANNING_CAUTION, SEA_ROUTE_CAUTION } from './cautions'

export const TABLE_DIRECT_CAUTION = 'Direct distances are geodesics between the two places, not sailing routes: they ignore land, traffic separation and routeing.'
export const TABLE_ECA_CAUTION = 'Distances inside ECAs follow the company\'s zones in force when the table was built; zones laid from memory are approximate and the MARPOL Annex VI coordinates rule.'

/** Quoted when needed; a leading =, +, -, @ gets an apostrophe so spreadsheets do not run it as a formula. */
function cell(text: string): string {
  const safe = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text
  return /[",\n\r]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe
}

/** Source mark of a pair: P<plan id> approved plan, S sea route, D direct, DL direct crossing land. */
export function sourceMark(matrix: NonNullable<DistanceTableDetail['matrix']>, k: number): string {
  const plan = matrix.planId[k]
  if (plan) return `P${plan}`
  if (matrix.source[k] === 'sea') return 'S'
  return matrix.crossesLand[k] ? 'DL' : 'D'
}

export function distanceTableCsv(table: DistanceTableDetail): string {
  const { places, matrix } = table
  if (!matrix) return ''
  const n = places.length
  const header = (title: string) => [title, ...places.map(p => cell(p.name))].join(',')
  const grid = (value: (k: number) => string) => places.map((p, i) =>
    [cell(p.name), ...places.map((_, j) => (i === j ? '' : value(pairIndex(i, j, n))))].join(','))
  const lines = [
    header('Distance (nm)'),
    ...grid(k => matrix.distanceNm[k]!.toFixed(1)),
    '',
    header('Source'),
    ...grid(k => sourceMark(matrix, k)),
    '',
    header('Inside ECAs (nm)'),
    ...grid(k => (matrix.ecaNm[k] == null ? '' : matrix.ecaNm[k]!.toFixed(1))),
    '',
    header('Passages'),
    ...grid(k => cell((matrix.via[k] ?? []).join(' '))),
    '',
    'Key',
    ...matrix.plans.map(p => `P${p.id},${cell(`approved plan: ${p.title}`)}`),
    `S,${cell(`computed sea route${table.avoid.length ? `, avoiding ${table.avoid.join(' ')}` : ''}`)}`,
    'D,direct — no sea route joins the places; not a sailing route',
    `DL,direct — not a sailing route; crosses land (coarse check every ${matrix.landStepNm} nm)`,
    '',
    ...matrix.passages.map(p => `${p.id},${cell(p.name)}`),
    '',
    cell(`Table: ${table.name}; plan end points within ${table.radiusNm} nm of the places`),
    cell(SEA_ROUTE_CAUTION),
    cell(TABLE_DIRECT_CAUTION),
    cell(TABLE_ECA_CAUTION),
    cell(LAND_CHECK_CAUTION),
    cell(PLANNING_CAUTION),
  ]
  return `${lines.join('\r\n')}\r\n`
}
