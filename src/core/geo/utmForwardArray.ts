import type { LocalFrame } from './localFrame';

// WGS84 as the UTM definition gives it: a and the inverse flattening; e² from a and b = a(1 − f).
const A = 6378137;
const RF = 298.257223563;
const B = (1 - 1 / RF) * A;
const ES = (A * A - B * B) / (A * A);
const K0 = 0.9996;
const D2R = 0.017453292519943295;
// Longitudes more than this from the central meridian are brought back by one turn first (PROJ's
// threshold, a hair over π, kept so results match proj4 to the bit).
// biome-ignore lint/suspicious/noApproximativeNumericConstant: the value is PROJ's, not an approximation of π
const WRAP_RAD = 3.14159265359;
// |η'| beyond this is past the series' domain (about 80° of longitude from the central meridian).
const ETA_LIMIT = 2.623395162778;

/**
 * Krüger series coefficients to n⁶ for the third flattening n of WGS84: geodetic → conformal
 * latitude (`cbg`) and conformal sphere → transverse Mercator (`gtu`, α₁…α₆), and the rectifying
 * radius A/a times k0 (`qn`). Same polynomials and evaluation order as PROJ's etmerc, so the grid
 * coordinates agree with proj4 to the last bit.
 * Source: Karney 2011, "Transverse Mercator with an accuracy of a few nanometers", J. Geodesy 85,
 * 475–485 (Krüger's series in n); Engsager & Poder 2007 (the same series as PROJ's etmerc).
 */
function seriesCoefficients(): { cbg: Float64Array; gtu: Float64Array; qn: number } {
  const f = ES / (1 + Math.sqrt(1 - ES));
  const n = f / (2 - f);
  const cbg = new Float64Array(6);
  const gtu = new Float64Array(6);
  let np = n;
  cbg[0] = n * (-2 + n * (2 / 3 + n * (4 / 3 + n * (-82 / 45 + n * (32 / 45 + n * (4642 / 4725))))));
  np = np * n;
  cbg[1] = np * (5 / 3 + n * (-16 / 15 + n * (-13 / 9 + n * (904 / 315 + n * (-1522 / 945)))));
  np = np * n;
  cbg[2] = np * (-26 / 15 + n * (34 / 21 + n * (8 / 5 + n * (-12686 / 2835))));
  np = np * n;
  cbg[3] = np * (1237 / 630 + n * (-12 / 5 + n * (-24832 / 14175)));
  np = np * n;
  cbg[4] = np * (-734 / 315 + n * (109598 / 31185));
  np = np * n;
  cbg[5] = np * (444337 / 155925);
  np = n * n;
  const qn = (K0 / (1 + n)) * (1 + np * (1 / 4 + np * (1 / 64 + np / 256)));
  gtu[0] = n * (0.5 + n * (-2 / 3 + n * (5 / 16 + n * (41 / 180 + n * (-127 / 288 + n * (7891 / 37800))))));
  gtu[1] = np * (13 / 48 + n * (-3 / 5 + n * (557 / 1440 + n * (281 / 630 + n * (-1983433 / 1935360)))));
  np = np * n;
  gtu[2] = np * (61 / 240 + n * (-103 / 140 + n * (15061 / 26880 + n * (167603 / 181440))));
  np = np * n;
  gtu[3] = np * (49561 / 161280 + n * (-179 / 168 + n * (6601661 / 7257600)));
  np = np * n;
  gtu[4] = np * (34729 / 80640 + n * (-3418889 / 1995840));
  np = np * n;
  gtu[5] = np * (212378941 / 319334400);
  return { cbg, gtu, qn };
}

const { cbg: CBG, gtu: GTU, qn: QN } = seriesCoefficients();

function hypotScaled(x: number, y: number): number {
  const ax = Math.abs(x);
  const ay = Math.abs(y);
  const a = Math.max(ax, ay);
  const b = Math.min(ax, ay) / (a ? a : 1);
  return a * Math.sqrt(1 + b * b);
}

function asinhAccurate(x: number): number {
  const ax = Math.abs(x);
  const u = ax * (1 + ax / (hypotScaled(1, ax) + 1));
  const v = 1 + u;
  const w = v - 1;
  const r = w === 0 ? u : (u * Math.log(v)) / w;
  return x < 0 ? -r : r;
}

/**
 * Projects interleaved WGS84 lon/lat degrees (lon0, lat0, lon1, lat1, …) into `frame`'s UTM zone in
 * one pass, writing interleaved easting/northing metres into `out` (allocated when not given; may be
 * the input array itself). Same results as `frame.toXY` (proj4's etmerc, bit for bit) without a
 * per-point object. A position beyond the series' reach (≈80° of longitude off the zone's meridian)
 * comes out as Infinity, as with proj4.
 * @param frame the site's UTM frame (zone and hemisphere are used)
 * @param lonLat interleaved longitude, latitude in degrees
 * @param out interleaved x, y in metres, at least `lonLat.length` long
 * @returns `out`
 * Source: Krüger series to order n⁶ — Karney 2011, "Transverse Mercator with an accuracy of a few
 * nanometers", J. Geodesy 85, 475–485; Clenshaw summation of the trigonometric series (Clenshaw 1955,
 * Math. Tables Aids Comput. 9).
 * Throws RangeError when `out` is shorter than the input.
 */
export function utmForwardArray(frame: Pick<LocalFrame, 'zone' | 'hemisphere'>, lonLat: ArrayLike<number>, out?: Float64Array): Float64Array {
  const n = lonLat.length - (lonLat.length % 2);
  const dst = out ?? new Float64Array(n);
  if (dst.length < n) throw new RangeError(`the output array holds ${dst.length} values, ${n} are needed`);
  const lam0 = (6 * Math.abs(frame.zone) - 183) * D2R;
  const y0 = frame.hemisphere === 'S' ? 1e7 : 0;
  for (let i = 0; i < n; i += 2) {
    let lam = lonLat[i] * D2R - lam0;
    // Across the antimeridian: wrap in degrees, so that −180° and +180° land on the same easting to the bit
    // (the two halves of a stratum split there then share their edge exactly).
    if (!(Math.abs(lam) <= WRAP_RAD)) lam = (lonLat[i] - (lam < 0 ? -360 : 360)) * D2R - lam0;
    const phi = lonLat[i + 1] * D2R;
    // Conformal latitude χ by a Clenshaw sum of sin(2kφ) terms.
    const cos2 = 2 * Math.cos(2 * phi);
    let h1 = CBG[5];
    let h2 = 0;
    let h = 0;
    for (let k = 4; k >= 0; k--) {
      h = -h2 + cos2 * h1 + CBG[k];
      h2 = h1;
      h1 = h;
    }
    const chi = phi + h * Math.sin(2 * phi);
    // Spherical transverse Mercator on the conformal sphere: ξ', η'.
    const sinChi = Math.sin(chi);
    const cosChi = Math.cos(chi);
    const sinLam = Math.sin(lam);
    const cosLam = Math.cos(lam);
    const xiP = Math.atan2(sinChi, cosLam * cosChi);
    const etaP = asinhAccurate(Math.tan(Math.atan2(sinLam * cosChi, hypotScaled(sinChi, cosChi * cosLam))));
    // ξ + iη = ζ' + Σ αk sin(2kζ'), by a complex Clenshaw sum.
    const sr = Math.sin(2 * xiP);
    const cr = Math.cos(2 * xiP);
    const ex = Math.exp(2 * etaP);
    const shi = (ex - 1 / ex) / 2;
    const coshEta2 = (ex + 1 / ex) / 2;
    const r = 2 * cr * coshEta2;
    const im = -2 * sr * shi;
    let hr = GTU[5];
    let hi = 0;
    let hr1 = 0;
    let hi1 = 0;
    let hr2: number;
    let hi2: number;
    for (let k = 4; k >= 0; k--) {
      hr2 = hr1;
      hi2 = hi1;
      hr1 = hr;
      hi1 = hi;
      hr = -hr2 + r * hr1 - im * hi1 + GTU[k];
      hi = -hi2 + im * hr1 + r * hi1;
    }
    const pr = sr * coshEta2;
    const pim = cr * shi;
    const xi = xiP + (pr * hr - pim * hi);
    const eta = etaP + (pr * hi + pim * hr);
    if (Math.abs(eta) <= ETA_LIMIT) {
      dst[i] = A * (QN * eta) + 5e5;
      dst[i + 1] = A * (QN * xi) + y0;
    } else {
      dst[i] = Infinity;
      dst[i + 1] = Infinity;
    }
  }
  return dst;
}
