/** A place from the library as `GET /api/places` lists it. */
export interface PlaceListItem {
  id: number
  name: string
  kind: string
  lat: number
  lon: number
  unlocode: string | null
  timeZone: string | null
}
