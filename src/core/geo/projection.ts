import proj4 from 'proj4';

/** A map projection from WGS84 longitude/latitude to its own x/y and back. */
export interface Projection {
  forward(lon: number, lat: number): [number, number];
  inverse(x: number, y: number): [number, number];
}

/** What a projection definition says about itself, as proj4 parsed it. */
export interface ProjectionParsed {
  /** proj4's name of the projection method ("utm", "tmerc", "longlat"…), when it gave one. */
  projName?: string;
  datum?: { datum_type?: number; a?: number };
  a?: number;
}

/**
 * The only place stratplot calls proj4: a projection from EPSG:4326 to the given definition (a
 * proj string or WKT). Throws proj4's own error on a definition it cannot read; callers turn that
 * into an InputError that names the file. Source: proj4js (Krüger series for transverse Mercator).
 */
export function projectionFrom(definition: string): Projection {
  const converter = proj4('EPSG:4326', definition);
  return {
    forward: (lon, lat) => converter.forward([lon, lat]) as [number, number],
    inverse: (x, y) => converter.inverse([x, y]) as [number, number],
  };
}

/** proj4's reading of a definition (method, datum, ellipsoid axis); throws on one it cannot read. */
export function projectionParse(definition: string): ProjectionParsed {
  return proj4.Proj(definition) as unknown as ProjectionParsed;
}
