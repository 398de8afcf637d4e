// WGS84 and unit constants in one place (NIMA TR8350.2; Karney 2013, table 1).

/** WGS84 equatorial radius, metres (NIMA TR8350.2). */
export const WGS84_A = 6378137
/** WGS84 flattening (NIMA TR8350.2). */
export const WGS84_F = 1 / 298.257223563
/** First eccentricity squared e² = f(2 − f). */
export const WGS84_E2 = WGS84_F * (2 - WGS84_F)
/** First eccentricity e. */
export const WGS84_E = Math.sqrt(WGS84_E2)
/** Polar semi-axis b = a(1 − f), metres. */
export const WGS84_B = WGS84_A * (1 - WGS84_F)
/** Third flattening n = f / (2 − f) = (a − b)/(a + b). */
export const WGS84_N = WGS84_F / (2 - WGS84_F)
/** International nautical mile, metres (1929). */
export const NM_M = 1852
/** Degrees per radian. */
export const DEG_PER_RAD = 180 / Math.PI
/** Radians per degree. */
export const RAD_PER_DEG = Math.PI / 180
