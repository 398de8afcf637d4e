// Stored leg tables (table plan_legs): computed once per saved version, in the transaction that
// saves the waypoints or the header, and read back as the JSON the API sends. A plan that is not
// yet approved is recomputed when the engine or the company's zones changed since; an approved
// plan keeps its stored legs, so what the master approved stays exactly what was approved.
import type { Knex } from 'knex'
import type { PlanDetail } from '#shared/types/plan'
import type { Waypoint } from '#shared/types/waypoint'
import type { LegZoneDistance } from '#shared/utils/zones/types'
import { computeLegTable } from '#shared/utils/legTable'

/** Names what the leg engine computes: a new name recomputes every plan not yet approved. */
export const LEG_ENGINE = 'legs-2026-12-02'

type Db = Knex | Knex.Transaction
type LegPlan = Pick<PlanDetail, 'id' | 'companyId' | 'version' | 'status' | 'departureUtc' | 'speedKn'>
export interface FuelInput { legs: { speedKn: number, hours: number, distanceNm: number }[], zones: LegZoneDistance[][] }
export interface StoredLegs { legsJson: string, totalsJson: string, fuelInput: FuelInput }
export interface StoredLegsRow { plan_version: number, engine: string, zone_signature: string, legs_json: string, totals_json: string, fuel_input_json: string }

/** Legs with their zone distances and totals for the given waypoints, stored for the plan's version. */
export async function storeLegs(db: Db, plan: LegPlan, waypoints: readonly Waypoint[]): Promise<StoredLegs> {
  const table = computeLegTable(waypoints, plan.departureUtc, plan.speedKn)
  const { signature, prepared } = await companyZones(plan.companyId, db)
  const zones = zonesForLegs(prepared, table.legs)
  const stored: StoredLegs = {
    legsJson: JSON.stringify(table.legs.map((l, i) => ({ ...l, zones: zones.legs[i]! }))),
    totalsJson: JSON.stringify({ ...table.totals, zones: zones.totals }),
    fuelInput: { legs: table.legs.map(l => ({ speedKn: l.speedKn, hours: l.hours, distanceNm: l.distanceNm })), zones: zones.legs },
  }
  const row = { plan_id: plan.id, plan_version: plan.version, engine: LEG_ENGINE, zone_signature: signature, legs_json: stored.legsJson, totals_json: stored.totalsJson, fuel_input_json: JSON.stringify(stored.fuelInput) }
  // A read that computed for an older version never overwrites the legs of a newer one; an approved plan's legs are never replaced.
  await db.raw(`? on conflict (plan_id) do update set plan_version = excluded.plan_version, engine = excluded.engine, zone_signature = excluded.zone_signature,
    legs_json = excluded.legs_json, totals_json = excluded.totals_json, fuel_input_json = excluded.fuel_input_json, computed_at = now()
    where plan_legs.plan_version <= excluded.plan_version and not exists (select 1 from plans where plans.id = plan_legs.plan_id and plans.status = 'approved')`,
  [db('plan_legs').insert(row)])
  return stored
}

/**
 * Whether a stored row still holds the plan's legs. Waypoints and header change only in a draft (or a
 * returned plan), each change storing its legs: a submitted or approved plan's row is its current one.
 */
export async function storedLegsCurrent(plan: LegPlan, row: Partial<StoredLegsRow> | null | undefined): Promise<boolean> {
  if (row?.legs_json == null) return false
  if (plan.status === 'approved') return true
  if (row.engine !== LEG_ENGINE) return false
  if (plan.status !== 'submitted' && row.plan_version !== plan.version) return false
  return row.zone_signature === (await companyZones(plan.companyId)).signature
}
