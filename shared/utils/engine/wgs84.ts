// The one geographiclib-geodesic set-up (Karney, "Algorithms for geodesics", J. Geodesy 87, 2013):
// the default import is the one that works on the server (named imports build, then fail at run time).
import geodesic from 'geographiclib-geodesic'

/** The Geodesic class, for its capability masks (G.LATITUDE | G.LONGITUDE, …). */
export const G = geodesic.Geodesic
/** The WGS84 ellipsoid's geodesic solver. */
export const geod = G.WGS84
