import type { LineString, MultiLineString, MultiPoint, MultiPolygon, Point, Polygon, Position } from 'geojson';

/** A WGS84 position as GeoJSON orders it: longitude then latitude, in degrees. */
export type LonLat = Position;

/** Metres east and north in a site's local metric frame (a UTM zone); never mixed with LonLat. */
export type XY = readonly [x: number, y: number] & { readonly __frame: 'utm-metres' };

/** Geometry a stratum part may have. */
export type AreaGeometry = Polygon | MultiPolygon;

/** Geometry an exclusion may have: a hazard point, a cliff line, a water or land polygon. */
export type ExclusionGeometry = Point | MultiPoint | LineString | MultiLineString | Polygon | MultiPolygon;

/** The kinds of ground a plot must keep clear of. */
export const EXCLUSION_KINDS = ['cliff', 'water', 'private', 'hazard', 'other'] as const;
export type ExclusionKind = (typeof EXCLUSION_KINDS)[number];

/** Safety buffer, in metres, applied when an exclusion carries no `buffer_m` (common practice, no source). */
export const DEFAULT_BUFFER_M: Readonly<Record<ExclusionKind, number>> = {
  cliff: 15,
  water: 10,
  private: 0,
  hazard: 30,
  other: 0,
};

/** A stratum as the design sees it: one key, however many map features carry it. */
export interface StratumInfo {
  /** The value of the stratum field that groups features, e.g. "Coastal heath". */
  key: string;
  /** Human label; defaults to the key. */
  label: string;
  /** Short upper-case code used to build GPS-friendly plot ids, e.g. "HEA". */
  code: string;
  /** Display colour as #rrggbb. */
  colour: string;
}

/** One mapped feature that belongs to a stratum. */
export interface StratumPart {
  id: string;
  stratum: string;
  geometry: AreaGeometry;
  properties?: Record<string, unknown>;
}

/** Ground that no plot footprint may touch, widened by its safety buffer. */
export interface Exclusion {
  id: string;
  kind: ExclusionKind;
  geometry: ExclusionGeometry;
  bufferM: number;
  name?: string;
  /** Access conditions or hazard description shown to crews. */
  notes?: string;
}

/** A place crews start walking from. */
export interface AccessPoint {
  id: string;
  name: string;
  kind: 'car_park' | 'gate' | 'landing' | 'other';
  lon: number;
  lat: number;
  notes?: string;
}

/** Everything mapped about a site, all in WGS84. */
export interface Site {
  name: string;
  strata: StratumInfo[];
  parts: StratumPart[];
  exclusions: Exclusion[];
  access: AccessPoint[];
  boundary: AreaGeometry | null;
}

/** Where a problem is: which input feature, which ring and vertex, and a position to zoom to. */
export interface ProblemLocation {
  featureIndex: number;
  featureId?: string;
  ring?: number;
  vertex?: number;
  lonLat?: LonLat;
  /** Which of the site's layers the feature belongs to (absent: strata). */
  layer?: 'strata' | 'exclusions' | 'access' | 'boundary';
  /** Tables (e.g. field results): the row as a spreadsheet numbers it (header = row 1) and the column name. */
  row?: number;
  column?: string;
}

/** A problem found in the input, worded for the person who made the map. */
export interface Problem {
  severity: 'error' | 'warning';
  code: string;
  message: string;
  where: ProblemLocation;
  areaM2?: number;
}
