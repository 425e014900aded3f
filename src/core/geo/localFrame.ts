import { projectionFrom } from './projection';
import type { LonLat, XY } from '../model/types';

/** A site's local metric frame: one UTM zone on WGS84, with its forward and inverse transforms. */
export interface LocalFrame {
  /** Zone number 1–60. */
  zone: number;
  hemisphere: 'N' | 'S';
  /** Zone and hemisphere letter, e.g. "55S" (not the MGRS latitude band). */
  utmZone: string;
  /** EPSG code of the zone, e.g. 32755. */
  epsg: number;
  /** proj4 definition string of the zone. */
  proj4: string;
  toXY(lon: number, lat: number): XY;
  toLonLat(x: number, y: number): LonLat;
}

/**
 * UTM zone number of a WGS84 position, with the Norway (32V) and Svalbard (31X–37X) exceptions.
 * Source: NGA.SIG.0012 (UTM/UPS grid definition), zone layout of the UTM system.
 */
export function utmZoneNumber(lon: number, lat: number): number {
  const l = ((((lon + 180) % 360) + 360) % 360) - 180;
  let zone = Math.floor((l + 180) / 6) + 1;
  if (zone > 60) zone = 60;
  if (lat >= 56 && lat < 64 && l >= 3 && l < 12) zone = 32;
  if (lat >= 72 && lat < 84) {
    if (l >= 0 && l < 9) zone = 31;
    else if (l >= 9 && l < 21) zone = 33;
    else if (l >= 21 && l < 33) zone = 35;
    else if (l >= 33 && l < 42) zone = 37;
  }
  return zone;
}

/**
 * The UTM frame for a position (use the site centroid): zone by {@link utmZoneNumber}, southern
 * hemisphere for lat < 0. Transforms go through proj4 (Krüger series, sub-millimetre in the zone).
 * Throws a RangeError outside UTM's latitude range (80°S–84°N).
 */
export function localFrameAt(lon: number, lat: number): LocalFrame {
  if (!(lat >= -80 && lat <= 84) || !Number.isFinite(lon)) {
    throw new RangeError(`position ${lon}, ${lat} is outside the UTM latitude range (80°S to 84°N)`);
  }
  return localFrameOfZone(utmZoneNumber(lon, lat), lat < 0 ? 'S' : 'N');
}

/** The UTM frame of a zone (1–60) and hemisphere, as a design records it (see {@link localFrameAt}). */
export function localFrameOfZone(zone: number, hemisphere: 'N' | 'S'): LocalFrame {
  const def = `+proj=utm +zone=${zone}${hemisphere === 'S' ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`;
  const projection = projectionFrom(def);
  return {
    zone,
    hemisphere,
    utmZone: `${zone}${hemisphere}`,
    epsg: (hemisphere === 'N' ? 32600 : 32700) + zone,
    proj4: def,
    toXY: (lonDeg, latDeg) => projection.forward(lonDeg, latDeg) as unknown as XY,
    toLonLat: (x, y) => projection.inverse(x, y),
  };
}

/** The frame a design recorded as its EPSG code (32601–32660 north, 32701–32760 south), or null for any other code. */
export function localFrameOfEpsg(epsg: number): LocalFrame | null {
  const zone = epsg % 100;
  const base = epsg - zone;
  if (!(zone >= 1 && zone <= 60) || (base !== 32600 && base !== 32700)) return null;
  return localFrameOfZone(zone, base === 32600 ? 'N' : 'S');
}
