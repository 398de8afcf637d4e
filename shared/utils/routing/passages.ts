// Declared passages for the sea router: canals and straits where the coarse coastline is closed or
// where ships follow a fairway, and open-water straits a navigator wants named when a route uses
// them. Positions are [lat, lon]. Sources: "from memory" (chart and pilot-book knowledge, not
// copied from a publication) or "common practice"; they are approximate and only steer the router.
export type PassageKind = 'canal' | 'strait'

export interface Passage {
  id: string
  name: string
  kind: PassageKind
  /** Transit length of a canal, nm. */
  transitNm?: number
  /**
   * Fairway points in order, joined to the graph at both ends. Legs between them are sailed as
   * they are and may cross the coarse coastline (a canal, a narrow strait).
   */
  fairway?: [number, number][]
  /** Half-width (nm) of the corridor round the fairway inside which a planned leg counts as following the passage. */
  corridorNm?: number
  /** A line across the passage, from land to land: a route crossing it uses the passage; avoiding it blocks the crossing. */
  gate: [[number, number], [number, number]]
  source: string
}

export const PASSAGES: readonly Passage[] = [
  {
    id: 'suez', name: 'Suez Canal', kind: 'canal', transitNm: 88,
    fairway: [[31.42, 32.36], [31.27, 32.315], [31.0, 32.31], [30.85, 32.32], [30.7, 32.34], [30.59, 32.3], [30.45, 32.35], [30.35, 32.4], [30.22, 32.48], [30.07, 32.56], [29.93, 32.565], [29.84, 32.55]],
    gate: [[30.6, 32.05], [30.6, 32.6]],
    source: 'Fairway from memory (Port Said to Port Tewfik); transit about 88 nm, from memory',
  },
  {
    id: 'panama', name: 'Panama Canal', kind: 'canal', transitNm: 44,
    fairway: [[9.42, -79.92], [9.35, -79.915], [9.27, -79.92], [9.2, -79.88], [9.15, -79.83], [9.12, -79.76], [9.1, -79.69], [9.05, -79.66], [9.016, -79.612], [8.997, -79.591], [8.95, -79.57], [8.88, -79.52]],
    gate: [[9.3, -79.75], [9.05, -79.9]],
    source: 'Fairway from memory (Cristóbal to Balboa); transit about 44 nm, from memory',
  },
  {
    id: 'kiel', name: 'Kiel Canal', kind: 'canal', transitNm: 53,
    fairway: [[53.88, 9.15], [53.96, 9.22], [54.04, 9.29], [54.15, 9.4], [54.25, 9.55], [54.3, 9.67], [54.33, 9.85], [54.36, 10.02], [54.365, 10.14], [54.4, 10.17], [54.47, 10.22]],
    gate: [[54.2, 9.67], [54.4, 9.67]],
    source: 'Fairway from memory (Brunsbüttel to Kiel-Holtenau); 98 km, about 53 nm, from memory',
  },
  {
    id: 'bosporus', name: 'Bosporus (Turkish Straits)', kind: 'strait',
    fairway: [[41.252, 29.122], [41.2, 29.106], [41.156, 29.063], [41.148, 29.063], [41.128, 29.079], [41.064, 29.047], [41.044, 29.026], [41.032, 28.999], [40.984, 28.999], [40.972, 28.984]],
    gate: [[41.08, 28.95], [41.08, 29.15]],
    source: 'Fairway laid from memory, then set to the middle of the channel on the 1:10m coastline',
  },
  {
    id: 'dardanelles', name: 'Dardanelles (Turkish Straits)', kind: 'strait',
    fairway: [[39.982, 26.122], [40.03, 26.201], [40.126, 26.368], [40.154, 26.389], [40.19, 26.384], [40.21, 26.421], [40.346, 26.636], [40.45, 26.766], [40.462, 26.782]],
    gate: [[40.18, 26.3], [40.1, 26.48]],
    source: 'Fairway laid from memory, then set to the middle of the channel on the 1:10m coastline',
  },
  {
    id: 'great-belt', name: 'Great Belt (Danish straits)', kind: 'strait',
    fairway: [[56.102, 11.057], [55.718, 10.804], [55.034, 11.064], [54.866, 10.916], [54.65, 10.972], [54.602, 11.057]],
    gate: [[55.34, 10.7], [55.34, 11.25]],
    source: 'Fairway laid from memory, then set to the middle of the channel on the 1:10m coastline',
  },
  {
    id: 'oresund', name: 'Øresund (Danish straits)', kind: 'strait',
    fairway: [[56.15, 12.503], [56.042, 12.659], [55.338, 12.816], [55.302, 12.901]],
    gate: [[55.95, 12.4], [55.95, 12.95]],
    source: 'Fairway laid from memory, then set to the middle of the channel on the 1:10m coastline',
  },
  {
    id: 'messina', name: 'Strait of Messina', kind: 'strait',
    fairway: [[38.322, 15.701], [38.25, 15.645], [38.202, 15.605], [38.022, 15.584]],
    gate: [[38.21, 15.5], [38.21, 15.75]],
    source: 'Fairway laid from memory, then set to the middle of the channel on the 1:10m coastline',
  },
  {
    id: 'singapore', name: 'Singapore Strait', kind: 'strait',
    fairway: [[1.302, 104.45], [1.198, 103.89], [1.122, 103.402]],
    gate: [[1.45, 104.0], [1.05, 104.0]],
    source: 'Fairway laid from memory, then set to the middle of the channel on the 1:10m coastline',
  },
  {
    id: 'magellan', name: 'Strait of Magellan', kind: 'strait',
    fairway: [[-52.442, -68.292], [-52.442, -69.508], [-52.558, -69.675], [-52.758, -70.475], [-53.875, -71.008], [-53.908, -71.425], [-53.642, -72.308], [-53.558, -72.458], [-53.558, -72.558], [-53.442, -72.825], [-53.225, -73.275], [-52.992, -73.658], [-52.442, -74.992]],
    gate: [[-52.3, -69.6], [-52.8, -69.6]],
    source: 'Fairway from memory (Primera and Segunda Angostura, Cabo Froward, Paso Inglés, Long Reach), then set to the middle of the channel on the 1:10m coastline; gate from memory',
  },
  {
    id: 'houston', name: 'Houston Ship Channel (Galveston Bay)', kind: 'canal',
    fairway: [[29.3, -94.65], [29.34, -94.72], [29.45, -94.84], [29.55, -94.93], [29.62, -94.98], [29.7, -95.0]],
    gate: [[29.45, -94.95], [29.55, -94.81]],
    source: 'Fairway from memory (sea buoy, Bolivar Roads, the dredged channel up Galveston Bay to Morgan\'s Point and Barbours Cut); the 1:10m coastline closes the bay',
  },
  {
    id: 'st-lawrence', name: 'St. Lawrence (Québec – Montréal)', kind: 'strait',
    fairway: [[46.81, -71.2], [46.75, -71.29], [46.69, -71.88], [46.55, -72.1], [46.34, -72.53], [46.15, -72.95], [46.04, -73.12], [45.9, -73.22], [45.8, -73.3], [45.65, -73.47], [45.56, -73.52]],
    gate: [[46.4, -72.6], [46.28, -72.45]],
    source: 'Ship channel from memory (Québec, Portneuf, Trois-Rivières, Lac Saint-Pierre, Sorel, Contrecœur, Montréal); the 1:10m coastline closes the river above Québec',
  },
  { id: 'torres', name: 'Torres Strait', kind: 'strait', gate: [[-11.0, 142.3], [-9.0, 142.3]], source: 'Gate from memory' },
  { id: 'dover', name: 'Dover Strait', kind: 'strait', gate: [[51.18, 1.3], [50.84, 1.65]], source: 'Gate from memory' },
  { id: 'gibraltar', name: 'Strait of Gibraltar', kind: 'strait', gate: [[36.1, -5.6], [35.8, -5.6]], source: 'Gate from memory' },
  { id: 'bab-el-mandeb', name: 'Bab-el-Mandeb', kind: 'strait', gate: [[12.8, 43.5], [12.45, 43.2]], source: 'Gate from memory' },
  { id: 'hormuz', name: 'Strait of Hormuz', kind: 'strait', gate: [[26.3, 56.35], [27.4, 56.35]], source: 'Gate from memory' },
  { id: 'malacca', name: 'Malacca Strait', kind: 'strait', gate: [[2.65, 101.85], [1.85, 101.25]], source: 'Gate from memory' },
]

export const PASSAGE_IDS = PASSAGES.map(p => p.id)
