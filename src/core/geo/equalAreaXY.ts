const A = 6378137;
const F = 1 / 298.257223563;
const E2 = F * (2 - F);
const E = Math.sqrt(E2);
const DEG = Math.PI / 180;

/**
 * Snyder's q(φ) of the WGS84 ellipsoid, from sin φ (dimensionless; q at the pole is q_p ≈ 1.9955).
 * Source: Snyder, Map Projections — A Working Manual, USGS PP 1395 (1987), eq. 3-12.
 */
export function authalicQ(sinLat: number): number {
  const es = E * sinLat;
  return (1 - E2) * (sinLat / (1 - es * es) - (1 / (2 * E)) * Math.log((1 - es) / (1 + es)));
}

/**
 * A Lambert cylindrical equal-area projection of the WGS84 ellipsoid centred on (lon0, lat0):
 * x = a·(λ − λ0), y = a·(q(φ) − q(φ0))/2, metres, so planar areas in it are ellipsoidal areas.
 * Longitudes are taken within ±180° of lon0 (rings across the antimeridian stay whole).
 * Source: Snyder 1987, eqs. 3-12 and 10-15 (normal aspect, k0 = 1).
 * @returns a function writing x, y (m) of (lon, lat) degrees into `out` at `at`
 */
export function equalAreaXY(lon0: number, lat0: number): (lon: number, lat: number, out: Float64Array, at: number) => void {
  const q0 = authalicQ(Math.sin(lat0 * DEG));
  return (lon, lat, out, at) => {
    let dLon = lon - lon0;
    if (dLon > 180) dLon -= 360;
    else if (dLon < -180) dLon += 360;
    out[at] = A * dLon * DEG;
    out[at + 1] = (A / 2) * (authalicQ(Math.sin(lat * DEG)) - q0);
  };
}
