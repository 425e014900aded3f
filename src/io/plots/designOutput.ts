import type { Feature, FeatureCollection } from 'geojson';
import { zipSync } from 'fflate';
import type { SqlJsStatic } from 'sql.js';
import type { PlotCollection, PlotProperties } from '../../core/model/designTypes';
import { FIELD_CAUTION } from '../../core/field/fieldCaution';
import { InputError, isInputError } from '../../core/common/InputError';
import { plotRejectionLines } from '../../core/field/plotFieldState';
import type { PlotsAnnotateOptions, } from '../../core/field/plotsAnnotate';
import type { Site } from '../../core/model/types';
import { featuresToGeoJson } from '../formats/geojson/featuresToGeoJson';
import { featuresToGeoPackage } from '../formats/geopackage/featuresToGeoPackage';
import { featuresToGpx, type GpxLabels } from '../formats/gpx/featuresToGpx';
import { featuresToKml, featuresToKmz } from '../formats/kml/featuresToKml';
import { featuresToShapefileFiles } from '../formats/shapefile/featuresToShapefileZip';
import { plotsToCsv } from './plotsToCsv';
import { isRejectedPlot, navigationDescription, plotGpxLabels } from './plotGpxLabels';
import { shapefileCautionText } from './shapefileCautionText';
import { siteLayers } from './siteLayers';
import { stratumLabel } from '../../core/field/stratumLabel';
import { exportContext } from '../../core/field/exportContext';

/** File extensions {@link designOutputBytes} writes, with what each holds. */
export const DESIGN_OUTPUT_FORMATS: Record<string, string> = {
  geojson: 'GeoJSON plot file (with the design summary)',
  json: 'GeoJSON plot file (with the design summary)',
  gpx: 'GPX 1.1: plots and access points as waypoints, strata and exclusions as tracks',
  kml: 'KML 2.2 with folders for plots, strata, exclusions and access',
  kmz: 'KMZ (KML plus plot icons)',
  csv: 'CSV plot table for spreadsheets',
  zip: 'zipped shapefiles, one per layer and shape type',
  gpkg: 'GeoPackage with one table per layer',
  pdf: 'PDF design report (or field sheets)',
};

/** Options of {@link designOutputBytes}; each format uses those that apply to it. */
export interface DesignOutputOptions {
  /** CSV: start with a UTF-8 byte-order mark. */
  bom?: boolean;
  /** PDF: which document (default the design report) and paper (default A4). */
  pdf?: 'report' | 'sheets';
  paper?: 'a4' | 'letter';
  /** PDF: survey date for the field sheets and their magnetic declination. */
  surveyDate?: Date;
  /** GeoPackage: sql.js loader for the browser. */
  sqlJsInit?: () => Promise<SqlJsStatic>;
  /** Document name in GPX/KML (default the site name, else "stratplot design"). */
  name?: string;
  /**
   * Navigation and safety notes added to every plot when a site is given (access point, safety
   * thresholds); `false` writes the plots as they are. Plots that already carry navigation are
   * not annotated twice.
   */
  annotate?: Omit<PlotsAnnotateOptions, 'surveyDate'> | false;
}

function gpxLabels(f: Feature, index: number): GpxLabels {
  const p = (f.properties ?? {}) as Record<string, unknown>;
  if (typeof p.plot_id === 'string' && (p.role === 'primary' || p.role === 'reserve')) return plotGpxLabels(p as unknown as PlotProperties);
  const text = (v: unknown) => (v === null || v === undefined || v === '' ? undefined : String(v));
  if (typeof p.access_id === 'string') return { name: String(p.name), desc: `access: ${p.kind}`, type: 'access', cmt: text(p.notes) };
  if (typeof p.exclusion_id === 'string') {
    return { name: text(p.name) ?? `${p.kind} ${p.exclusion_id}`, desc: `keep out: ${p.kind}, buffer ${p.buffer_m} m`, type: `exclusion-${p.kind}`, cmt: text(p.notes) };
  }
  if (typeof p.part_id === 'string') return { name: String(p.stratum), desc: `stratum ${stratumLabel(String(p.stratum), p.code as string | undefined)}`, type: 'stratum' };
  return { name: `feature ${index + 1}` };
}

function kmlDescription(collection: PlotCollection): string {
  const lines = plotRejectionLines(collection);
  return lines.length ? `${FIELD_CAUTION} Rejected plots (struck out on the map, do not visit): ${lines.join(' ')}` : FIELD_CAUTION;
}

function gpkgDescription(collection: PlotCollection): string {
  const lines = plotRejectionLines(collection);
  return lines.length ? `${FIELD_CAUTION} Field decisions: ${lines.join(' ')}` : FIELD_CAUTION;
}

function extensionOf(fileName: string): string {
  const dot = fileName.lastIndexOf('.');
  return dot >= 0 ? fileName.slice(dot + 1).toLowerCase() : '';
}

/**
 * The bytes of a design export, the format chosen by `fileName`'s extension (see
 * {@link DESIGN_OUTPUT_FORMATS}). Plots always; with a site, also strata, exclusions (with their
 * buffers and notes) and access points in the formats that hold several layers (GPX, KML, KMZ,
 * shapefile zip, GeoPackage, PDF). GeoJSON and CSV hold the plot list only.
 * Every file follows the plan: strata by their current names and codes (from the site, when
 * given), every plot by its field state (`field_state`, `field_note`; rejected plots are left out
 * of GPX and struck out elsewhere, with their reasons), and the safety caution (GPX and KML
 * descriptions, a CSV column, a text file in the shapefile zip, the GeoPackage contents
 * description, every PDF).
 * Throws InputError for an unsupported extension (listing the supported ones) and whatever the
 * chosen writer throws (e.g. a PDF of an empty plot list).
 */
export async function designOutputBytes(
  fileName: string,
  collection: PlotCollection,
  site?: Site,
  options: DesignOutputOptions = {},
): Promise<Uint8Array> {
  try {
    return await designOutputUnchecked(fileName, collection, site, options);
  } catch (error) {
    if (isInputError(error) && !error.message.startsWith(`${fileName}:`)) throw new InputError(`${fileName}: ${error.message}`);
    throw error;
  }
}

async function designOutputUnchecked(fileName: string, plots: PlotCollection, site: Site | undefined, options: DesignOutputOptions): Promise<Uint8Array> {
  const enc = new TextEncoder();
  const context = exportContext(plots, site ?? null, { surveyDate: options.surveyDate, annotate: options.annotate });
  const collection = context.field;
  const layers = siteLayers(collection, site);
  const name = options.name ?? site?.name ?? 'stratplot design';
  const ext = extensionOf(fileName);
  switch (ext) {
    case 'geojson':
    case 'json':
      return enc.encode(featuresToGeoJson(collection));
    case 'csv':
      return enc.encode(plotsToCsv(collection, { bom: options.bom, caution: FIELD_CAUTION }));
    case 'gpx': {
      // A GPS must not lead a crew to a rejected plot: it is left out, and listed in the description.
      const all: FeatureCollection = { type: 'FeatureCollection', features: layers.flatMap((l) => l.features.features).filter((f) => !isRejectedPlot(f)) };
      const version = collection.design?.software?.version;
      const creator = `stratplot${version ? ` ${version}` : ''}`;
      return enc.encode(featuresToGpx(all, { name, description: navigationDescription(collection), creator, labels: gpxLabels }));
    }
    case 'kml':
      return enc.encode(featuresToKml(layers, { name, description: kmlDescription(collection) }));
    case 'kmz':
      return featuresToKmz(layers, { name, description: kmlDescription(collection) });
    case 'zip': {
      const files: Record<string, Uint8Array> = {};
      for (const l of layers) Object.assign(files, featuresToShapefileFiles(l.features, { layerName: l.name }));
      files['CAUTION.txt'] = enc.encode(shapefileCautionText(name, collection, layers));
      return zipSync(files, { level: 6, mtime: new Date('2000-01-01T00:00:00Z') });
    }
    case 'gpkg':
      return featuresToGeoPackage(layers, { sqlJsInit: options.sqlJsInit, description: gpkgDescription(collection) });
    case 'pdf':
      // The PDF writers (and their fonts) are loaded only when a PDF is asked for: they are most of the code.
      if (options.pdf === 'sheets') {
        const { fieldSheetsPdf } = await import('../pdf/fieldSheetsPdf');
        return fieldSheetsPdf(context, { paper: options.paper ?? 'a4', siteName: site?.name });
      }
      return (await import('../pdf/designReportPdf')).designReportPdf(context, { paper: options.paper ?? 'a4' });
    default:
      throw new InputError(
        `${fileName}: cannot tell the export format from the extension${ext ? ` ".${ext}"` : ''}; use one of ${Object.keys(DESIGN_OUTPUT_FORMATS)
          .map((e) => `.${e}`)
          .join(', ')}`,
      );
  }
}
