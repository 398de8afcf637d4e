// Real places with public coordinates (decimal degrees, rounded); invented plans between them.
type Method = 'geodesic' | 'rhumb'

export const demoPlaces = [
  { name: 'Yokohama', kind: 'port', lat: 35.4437, lon: 139.6380, unlocode: 'JPYOK', time_zone: 'Asia/Tokyo' },
  { name: 'Nojima Zaki offing', kind: 'ocean_position', lat: 34.85, lon: 139.95, unlocode: null, time_zone: 'Asia/Tokyo' },
  { name: 'Juan de Fuca Strait entrance', kind: 'strait', lat: 48.4950, lon: -124.8000, unlocode: null, time_zone: 'America/Vancouver' },
  { name: 'Port Angeles pilot station', kind: 'pilot_station', lat: 48.1420, lon: -123.4000, unlocode: null, time_zone: 'America/Los_Angeles' },
  { name: 'Seattle', kind: 'port', lat: 47.6030, lon: -122.3420, unlocode: 'USSEA', time_zone: 'America/Los_Angeles' },
  { name: 'Cape Town', kind: 'port', lat: -33.9080, lon: 18.4330, unlocode: 'ZACPT', time_zone: 'Africa/Johannesburg' },
  { name: 'Cape of Good Hope offing', kind: 'ocean_position', lat: -34.55, lon: 18.45, unlocode: null, time_zone: 'Africa/Johannesburg' },
  { name: 'Fremantle', kind: 'port', lat: -32.0550, lon: 115.7430, unlocode: 'AUFRE', time_zone: 'Australia/Perth' },
  { name: 'Fremantle pilot boarding ground', kind: 'pilot_station', lat: -32.0330, lon: 115.6000, unlocode: null, time_zone: 'Australia/Perth' },
  { name: 'Rotterdam', kind: 'port', lat: 51.9500, lon: 4.1400, unlocode: 'NLRTM', time_zone: 'Europe/Amsterdam' },
  { name: 'Maas Center', kind: 'pilot_station', lat: 52.0150, lon: 3.8833, unlocode: null, time_zone: 'Europe/Amsterdam' },
  { name: 'Ambrose pilot station', kind: 'pilot_station', lat: 40.4580, lon: -73.8330, unlocode: null, time_zone: 'America/New_York' },
  { name: 'New York', kind: 'port', lat: 40.6840, lon: -74.0440, unlocode: 'USNYC', time_zone: 'America/New_York' },
  { name: 'Singapore', kind: 'port', lat: 1.2640, lon: 103.8400, unlocode: 'SGSIN', time_zone: 'Asia/Singapore' },
  { name: 'Busan', kind: 'port', lat: 35.0800, lon: 129.0600, unlocode: 'KRPUS', time_zone: 'Asia/Seoul' },
  { name: 'Los Angeles', kind: 'port', lat: 33.7200, lon: -118.2700, unlocode: 'USLAX', time_zone: 'America/Los_Angeles' },
  { name: 'Honolulu', kind: 'port', lat: 21.3000, lon: -157.8700, unlocode: 'USHNL', time_zone: 'Pacific/Honolulu' },
  { name: 'Balboa (Panama Canal Pacific approach)', kind: 'canal_approach', lat: 8.8800, lon: -79.5200, unlocode: 'PABLB', time_zone: 'America/Panama' },
  { name: 'Port Said (Suez Canal approach)', kind: 'canal_approach', lat: 31.3500, lon: 32.3600, unlocode: 'EGPSD', time_zone: 'Africa/Cairo' },
  { name: 'Auckland', kind: 'port', lat: -36.8400, lon: 174.7700, unlocode: 'NZAKL', time_zone: 'Pacific/Auckland' },
]

interface DemoEvent { by: string, name: string, role: string, kind: string, from: string | null, to: string, remarks?: string, at: string }
interface DemoPlan {
  company?: 'larkspur', vessel: string, title: string, departureUtc: string, speedKn: number, limitLat?: number,
  status: 'draft' | 'submitted' | 'approved' | 'returned', from: string, to: string, createdBy: string,
  waypoints: [string, number, number, Method][], events?: DemoEvent[]
}

const planner = { by: 'planner@kestrel-bight.example', name: 'Tomas Verhoeven', role: 'planner' }
const master = { by: 'master@kestrel-bight.example', name: 'Capt. Mirela Oduya', role: 'master' }

export const demoPlans: DemoPlan[] = [
  {
    vessel: 'Kestrel Dawn', title: 'Yokohama – Juan de Fuca, North Pacific crossing', departureUtc: '2026-12-10T02:00:00Z', speedKn: 14.5, limitLat: 48.75,
    status: 'draft', from: 'Yokohama', to: 'Juan de Fuca Strait entrance', createdBy: planner.by,
    waypoints: [
      ['Yokohama', 35.4437, 139.6380, 'rhumb'],
      ['Nojima Zaki offing', 34.85, 139.95, 'rhumb'],
      ['Juan de Fuca Strait entrance', 48.4950, -124.8000, 'geodesic'],
      ['Port Angeles pilot station', 48.1420, -123.4000, 'rhumb'],
    ],
    events: [{ ...planner, kind: 'created', from: null, to: 'draft', at: '2026-11-28T09:00:00Z' }],
  },
  {
    vessel: 'Kestrel Meridian', title: 'Cape of Good Hope – Fremantle, held at 40°S', departureUtc: '2026-11-24T06:00:00Z', speedKn: 15, limitLat: 40,
    status: 'approved', from: 'Cape of Good Hope offing', to: 'Fremantle pilot boarding ground', createdBy: planner.by,
    waypoints: [
      ['Cape of Good Hope offing', -34.55, 18.45, 'rhumb'],
      ['40S 030E', -40, 30, 'geodesic'],
      ['40S 060E', -40, 60, 'rhumb'],
      ['40S 090E', -40, 90, 'rhumb'],
      ['40S 100E', -40, 100, 'rhumb'],
      ['Fremantle pilot boarding ground', -32.0330, 115.6000, 'geodesic'],
    ],
    events: [
      { ...planner, kind: 'created', from: null, to: 'draft', at: '2026-11-18T10:00:00Z' },
      { ...planner, kind: 'submitted', from: 'draft', to: 'submitted', at: '2026-11-19T15:20:00Z' },
      { ...master, kind: 'approved', from: 'submitted', to: 'approved', remarks: 'Approved. Keep north of 40°S; report ice sightings.', at: '2026-11-20T08:30:00Z' },
    ],
  },
  {
    vessel: 'Kestrel Dawn', title: 'Rotterdam – New York, North Atlantic', departureUtc: '2026-12-03T14:00:00Z', speedKn: 14,
    status: 'submitted', from: 'Maas Center', to: 'Ambrose pilot station', createdBy: planner.by,
    waypoints: [
      ['Maas Center', 52.0150, 3.8833, 'rhumb'],
      ['Dover Strait SW lane', 50.9500, 1.3000, 'rhumb'],
      ['Off Casquets', 49.9000, -2.6000, 'rhumb'],
      ['Bishop Rock offing', 49.7000, -6.7000, 'rhumb'],
      ['South of the Grand Banks', 44.0000, -50.0000, 'geodesic'],
      ['Nantucket shoals offing', 40.4000, -69.0000, 'geodesic'],
      ['Ambrose pilot station', 40.4580, -73.8330, 'rhumb'],
    ],
    events: [
      { ...planner, kind: 'created', from: null, to: 'draft', at: '2026-11-26T08:00:00Z' },
      { ...planner, kind: 'submitted', from: 'draft', to: 'submitted', at: '2026-11-30T16:45:00Z' },
    ],
  },
  {
    vessel: 'Bight Voyager', title: 'Los Angeles – Honolulu', departureUtc: '2026-12-06T18:00:00Z', speedKn: 13,
    status: 'returned', from: 'Los Angeles', to: 'Honolulu', createdBy: planner.by,
    waypoints: [
      ['Los Angeles', 33.7200, -118.2700, 'rhumb'],
      ['San Pedro Channel exit', 33.5500, -118.6000, 'rhumb'],
      ['Kaiwi Channel approach', 21.3500, -157.3000, 'geodesic'],
      ['Honolulu', 21.3000, -157.8700, 'rhumb'],
    ],
    events: [
      { ...planner, kind: 'created', from: null, to: 'draft', at: '2026-11-25T11:00:00Z' },
      { ...planner, kind: 'submitted', from: 'draft', to: 'submitted', at: '2026-11-27T09:10:00Z' },
      { by: 'relief.master@kestrel-bight.example', name: 'Capt. Anders Pellew', role: 'master', kind: 'returned', from: 'submitted', to: 'returned', remarks: 'Add the traffic separation scheme off Santa Barbara and a contingency anchorage.', at: '2026-11-28T07:40:00Z' },
    ],
  },
  {
    company: 'larkspur', vessel: 'Larkspur Tern', title: 'Auckland – Honolulu', departureUtc: '2026-12-12T00:00:00Z', speedKn: 12.5,
    status: 'draft', from: 'Auckland', to: 'Honolulu', createdBy: 'planner@larkspur-reach.example',
    waypoints: [
      ['Auckland', -36.8400, 174.7700, 'rhumb'],
      ['Cape Brett offing', -35.1000, 174.5000, 'rhumb'],
      ['Honolulu approach', 21.2000, -157.9000, 'geodesic'],
    ],
  },
]
