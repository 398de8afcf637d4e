// PostgreSQL's answer when a write raced another past the service's own check: a unique index
// (two creations of the same name at once) or a foreign key (a place deleted while a plan named
// it). Each becomes the 4xx the check would have given, naming the field, never a 500.

interface Conflict { statusCode: number, message: string }

const UNIQUE_INDEXES: Record<string, Conflict> = {
  users_email_unique: { statusCode: 409, message: 'email: a user with this address already exists' },
  places_company_lower_name_unique: { statusCode: 409, message: 'name: a place with this name is already in the library' },
  places_company_id_name_unique: { statusCode: 409, message: 'name: a place with this name is already in the library' },
  zones_company_name_unique: { statusCode: 409, message: 'name: a zone with this name already exists' },
  vessels_imo_number_unique: { statusCode: 409, message: 'imoNumber: this IMO number belongs to another vessel' },
  vessel_fuel_points_vessel_id_speed_kn_unique: { statusCode: 400, message: 'points: two points have the same speed (to 0.01 kn)' },
}

const PG_UNIQUE_VIOLATION = '23505'
const PG_FOREIGN_KEY_VIOLATION = '23503'

/** The 4xx for a unique or foreign-key violation anywhere in the error's causes, or null. */
export function databaseConflict(error: unknown): Conflict | null {
  for (let e: any = error, depth = 0; e && depth < 5; e = e.cause, depth++) {
    if (e.code === PG_UNIQUE_VIOLATION)
      return UNIQUE_INDEXES[e.constraint] ?? { statusCode: 409, message: 'Someone else saved the same record at the same moment; reload and try again' }
    if (e.code === PG_FOREIGN_KEY_VIOLATION)
      return { statusCode: 409, message: 'A record this refers to was removed at the same moment; reload and try again' }
  }
  return null
}
