import { fileURLToPath } from 'node:url';

/** The GPX 1.1 schema (Topografix), kept in the repository so validation works offline. */
export const GPX_XSD = fileURLToPath(new URL('./gpx-1.1.xsd', import.meta.url));
