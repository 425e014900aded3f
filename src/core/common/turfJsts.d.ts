declare module '@turf/jsts' {
  import type { Geometry } from 'geojson';

  /** A JTS geometry as the JavaScript port builds it (only what stratplot calls). */
  interface JstsGeometry {
    isEmpty(): boolean;
    getArea(): number;
  }
  const jsts: {
    GeoJSONReader: new () => { read(geometry: Geometry): JstsGeometry };
    GeoJSONWriter: new () => { write(geometry: JstsGeometry): Geometry };
    BufferOp: { bufferOp(geometry: JstsGeometry, distance: number, quadrantSegments: number): JstsGeometry };
  };
  export default jsts;
}
