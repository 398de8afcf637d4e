// Emission control areas as the trade knows them (MARPOL Annex VI, regulation 14 and Appendix VII;
// the North Sea and Baltic areas as defined in Annex V, regulation 1.14; the Mediterranean ECA in
// force from 1 May 2025). These outlines are APPROXIMATE, laid from memory of the regulation's
// descriptions, not copied from its coordinate lists: seaward limits are placed about 200 nm off the
// North American coasts and on the meridians and parallels the regulation names in Europe; landward
// sides run over land, where no ship sails. Edges are geodesics between the vertices. The
// regulation's coordinates rule; check them before relying on a figure.
import type { ZonePolygons } from '../../shared/utils/zones/types'

export interface SeedZone { name: string, kind: 'eca', source: string, validFrom: string | null, polygons: ZonePolygons }

const APPROX = 'approximate, laid from memory; MARPOL Annex VI reg. 14 and Appendix VII rule'

export const ecaZones: SeedZone[] = [
  {
    name: 'North Sea ECA (incl. English Channel)',
    kind: 'eca',
    source: `MARPOL Annex VI reg. 14.3.1 with Annex V reg. 1.14.6: the North Sea south of 62°N and east of 4°W, the Skagerrak to 57°44.8′N, the English Channel east of 5°W and north of 48°30′N (${APPROX})`,
    validFrom: '2006-11-22',
    polygons: [[[
      [-4.0, 62.0], [6.0, 62.0], [8.5, 60.5], [11.5, 60.3], [12.0, 58.6], [12.0, 57.7467], [10.55, 57.7467],
      [9.5, 57.0], [9.3, 55.6], [9.7, 54.3], [10.3, 53.4], [7.5, 52.4], [4.8, 50.8], [2.0, 50.2],
      [-1.0, 48.9], [-3.5, 48.5], [-5.0, 48.5], [-5.0, 50.1], [-4.2, 50.55], [-3.2, 50.8], [-2.0, 51.5],
      [-2.5, 53.0], [-2.5, 55.0], [-4.0, 56.5], [-4.0, 58.55], [-4.0, 62.0],
    ]]],
  },
  {
    name: 'Baltic Sea ECA',
    kind: 'eca',
    source: `MARPOL Annex VI reg. 14.3.1 with Annex V reg. 1.14.2: the Baltic Sea proper with the Gulfs of Bothnia and Finland and the entrance, bounded by the parallel of the Skaw at 57°44.8′N (${APPROX})`,
    validFrom: '2006-05-19',
    polygons: [[[
      [10.55, 57.7467], [12.0, 57.7467], [12.0, 58.6], [14.0, 61.0], [17.5, 63.5], [21.0, 66.5], [26.0, 66.3],
      [27.5, 63.0], [30.5, 61.5], [31.0, 59.8], [28.8, 57.8], [24.0, 55.0], [21.5, 54.1], [15.0, 53.4],
      [12.0, 53.6], [10.3, 53.4], [9.7, 54.3], [9.3, 55.6], [9.5, 57.0], [10.55, 57.7467],
    ]]],
  },
  {
    name: 'North American ECA',
    kind: 'eca',
    source: `MARPOL Annex VI reg. 14.3.2 and Appendix VII: about 200 nm off the Atlantic, Gulf of Mexico and Pacific coasts of the United States and Canada, and around the main Hawaiian Islands; in force for sulphur from 1 August 2012 (${APPROX}; south-east of Newfoundland the seaward side is drawn on the meridian of 50°30′W between 43°N and 45°N)`,
    validFrom: '2012-08-01',
    polygons: [
      [[
        [-64.15, 60.0], [-58.5, 60.0], [-56.0, 57.0], [-52.5, 54.5], [-48.5, 51.5], [-47.0, 48.5], [-47.5, 46.5],
        [-50.5, 45.0], [-50.5, 43.0], [-56.0, 42.2], [-61.0, 40.3], [-65.0, 39.8], [-67.5, 38.0], [-70.5, 35.8], [-72.0, 33.5], [-76.0, 30.5],
        [-77.3, 28.5], [-79.25, 27.2], [-79.6, 25.4], [-80.4, 24.1], [-82.0, 23.9], [-83.7, 24.0], [-85.8, 24.6],
        [-88.4, 25.8], [-93.0, 26.1], [-96.9, 26.0], [-97.15, 25.97], [-99.0, 28.0], [-96.0, 33.0], [-88.0, 35.0],
        [-80.0, 38.0], [-77.0, 41.0], [-73.0, 44.5], [-71.2, 46.8], [-70.0, 50.0], [-64.5, 55.0], [-64.15, 60.0],
      ]],
      [[
        [-117.12, 32.53], [-118.6, 31.1], [-121.5, 30.5], [-124.5, 34.0], [-127.3, 38.0], [-128.6, 41.0],
        [-129.5, 44.0], [-130.0, 47.0], [-131.5, 49.0], [-135.5, 51.5], [-139.0, 54.0], [-141.5, 56.0],
        [-145.5, 57.5], [-147.5, 59.0], [-146.0, 60.7], [-135.0, 59.5], [-128.0, 55.0], [-122.0, 49.5],
        [-120.0, 45.0], [-117.0, 35.0], [-116.5, 32.6], [-117.12, 32.53],
      ]],
      [[
        [-164.0, 21.5], [-163.3, 24.3], [-159.0, 25.2], [-155.0, 23.2], [-151.6, 20.0], [-153.2, 16.2],
        [-157.0, 16.4], [-161.4, 18.3], [-164.0, 21.5],
      ]],
    ],
  },
  {
    name: 'United States Caribbean Sea ECA',
    kind: 'eca',
    source: `MARPOL Annex VI reg. 14.3.2 and Appendix VII: waters around Puerto Rico and the United States Virgin Islands; in force from 1 January 2014 (${APPROX})`,
    validFrom: '2014-01-01',
    polygons: [[[
      [-68.4, 18.6], [-68.0, 21.4], [-65.3, 21.8], [-64.1, 20.1], [-64.7, 18.6], [-64.3, 17.5], [-64.9, 15.9],
      [-67.2, 15.8], [-68.4, 17.1], [-68.4, 18.6],
    ]]],
  },
  {
    name: 'Mediterranean Sea ECA',
    kind: 'eca',
    source: `MARPOL Annex VI reg. 14.3.3 with Annex V reg. 1.14.1: the Mediterranean Sea proper, bounded by 5°36′W at Gibraltar and by 41°N towards the Black Sea; in force from 1 May 2025 (${APPROX})`,
    validFrom: '2025-05-01',
    polygons: [[[
      [-5.6, 35.5], [-5.6, 36.6], [-4.0, 38.0], [-2.0, 40.0], [1.0, 42.5], [4.0, 44.0], [7.5, 45.5], [12.0, 46.5],
      [14.0, 46.0], [20.0, 42.5], [23.0, 41.6], [26.0, 41.4], [28.6, 41.1], [29.0, 41.0], [29.3, 41.0], [31.0, 40.5],
      [36.0, 37.5], [36.6, 37.0], [36.6, 35.5], [35.9, 33.0], [34.8, 31.0], [33.5, 30.7], [32.35, 30.9], [30.0, 30.0],
      [25.0, 31.0], [20.0, 29.5], [15.5, 30.5], [10.0, 33.0], [8.0, 36.0], [0.0, 35.0], [-3.0, 34.8], [-5.6, 35.5],
    ]]],
  },
]
