declare module 'shpjs' {
  import type { Geometry } from 'geojson';
  /** Geometry of every record of a .shp main file, in the file's own coordinates when no prj is given. */
  export function parseShp(shp: ArrayBuffer | Uint8Array | DataView, prj?: string | false): (Geometry | null)[];
}
