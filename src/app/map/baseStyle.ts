import type { FeatureCollection } from 'geojson';
import type { ExpressionSpecification, LayerSpecification, StyleSpecification } from 'maplibre-gl';
import { type OnlineTilesConfig, onlineTilesLayer, onlineTilesSource } from './onlineTiles';

/**
 * The basemap's own palette: a cool grey-green sea, pale lichen land, a thin slate coastline and
 * a faint dashed graticule, kept quiet so strata, exclusions and plots carry the colour.
 */
export const BASE_PALETTE = {
  sea: '#cdd8d5',
  land: '#e4e0cc',
  coast: '#6c7d77',
  graticule: '#5f7080',
  /** Land and sea both fade to this beyond zoom 11, where a 1:50 million coast would mislead. */
  paper: '#dedcce',
  label: '#3c4a55',
  labelHalo: '#f1efe4',
} as const;

/**
 * Font stack of basemap labels. The style has no `glyphs` URL, so maplibre (6.x) draws every
 * character locally with TinySDF in this CSS font family: labels work offline, with no font files.
 */
export const BASE_LABEL_FONT = ['system-ui', 'sans-serif'] as const;

/**
 * Caution to show with the basemap (e.g. in the map's help or legend): the offline coastline is
 * generalised and must not be used to find water, cliff edges or boundaries in the field.
 */
export const BASE_CAUTION =
  'The offline land and coastline are generalised world data (Natural Earth, 1:50 million), ' +
  'kilometres out at site scale: never use them to judge where water, cliff edges or property ' +
  'boundaries are. Check the ground against your own imagery, local maps, the landholder and ' +
  'your safety plan.';

/** Credit for the land data (public domain; the credit is a courtesy Natural Earth asks for). */
export const BASE_LAND_CREDIT = 'Land: Natural Earth (public domain)';

/** Source ids of the basemap. */
export const BASE_SOURCES = {
  land: 'base-land',
  coast: 'base-coast',
  graticule: 'base-graticule',
  onlineTiles: 'base-online-tiles',
} as const;

/** Layer ids of the basemap, bottom to top. */
export const BASE_LAYERS = {
  sea: 'base-sea',
  land: 'base-land-fill',
  coast: 'base-coastline',
  onlineTiles: 'base-online-tiles',
  graticule: 'base-graticule',
  graticuleLabels: 'base-graticule-labels',
} as const;

/**
 * Layer id to pass as `beforeId` when adding user imagery: it then lies above land, coast and
 * online tiles and below the graticule (and below everything the app adds later on top).
 */
export const BASE_IMAGERY_BEFORE_ID = BASE_LAYERS.graticule;

export interface BaseStyleInput {
  /** Land polygons (from worldLandLoad). */
  land: FeatureCollection;
  /** Coastlines (from worldLandLoad). */
  coast: FeatureCollection;
  /** Graticule lines for the current view (from graticuleLines); empty when omitted. */
  graticule?: FeatureCollection;
  /** Online raster tiles; drawn over the offline land only when `enabled`. */
  onlineTiles?: OnlineTilesConfig;
  /** Degree labels along the graticule lines (default true). */
  graticuleLabels?: boolean;
}

/*
 * Natural Earth 1:50 million coastlines are off by up to a few kilometres, so at site scale they
 * would draw sea over land. Beyond these zooms the basemap becomes plain paper and leaves the
 * ground to the user's imagery (common practice, no source).
 */
const FADE_FROM_ZOOM = 9;
const FADE_TO_ZOOM = 11;

function fadeToPaper(colour: string): ExpressionSpecification {
  return ['interpolate', ['linear'], ['zoom'], FADE_FROM_ZOOM, colour, FADE_TO_ZOOM, BASE_PALETTE.paper];
}

const EMPTY: FeatureCollection = { type: 'FeatureCollection', features: [] };

/**
 * The offline basemap as a maplibre style: sea background, land fill, coastline (all fading to
 * plain paper from zoom 9 to 11), optional online tiles above them (the offline land shows
 * through wherever tiles fail), then the graticule and its labels.
 * It has no `glyphs` URL, so it never asks the network for fonts: maplibre 6 then draws label
 * text locally (TinySDF, in {@link BASE_LABEL_FONT}) — seen working in headless Chromium.
 * @returns a StyleSpecification (version 8) with the ids in {@link BASE_SOURCES} and {@link BASE_LAYERS}
 */
export function baseStyleBuild(input: BaseStyleInput): StyleSpecification {
  const sources: StyleSpecification['sources'] = {
    [BASE_SOURCES.land]: { type: 'geojson', data: input.land, maxzoom: 10, tolerance: 0.5, attribution: BASE_LAND_CREDIT },
    [BASE_SOURCES.coast]: { type: 'geojson', data: input.coast, maxzoom: 10, tolerance: 0.5 },
    [BASE_SOURCES.graticule]: { type: 'geojson', data: input.graticule ?? EMPTY },
  };
  const layers: LayerSpecification[] = [
    { id: BASE_LAYERS.sea, type: 'background', paint: { 'background-color': fadeToPaper(BASE_PALETTE.sea) } },
    {
      id: BASE_LAYERS.land,
      type: 'fill',
      source: BASE_SOURCES.land,
      // Antimeridian cut edges are part of the fill, so its own outline stays off.
      paint: { 'fill-color': fadeToPaper(BASE_PALETTE.land), 'fill-antialias': false },
    },
    {
      id: BASE_LAYERS.coast,
      type: 'line',
      source: BASE_SOURCES.coast,
      layout: { 'line-join': 'round' },
      paint: {
        'line-color': BASE_PALETTE.coast,
        'line-opacity': ['interpolate', ['linear'], ['zoom'], FADE_FROM_ZOOM, 1, FADE_TO_ZOOM, 0],
        'line-width': ['interpolate', ['linear'], ['zoom'], 0, 0.4, 6, 0.8, 12, 1.2],
      },
    },
  ];
  if (input.onlineTiles?.enabled) {
    sources[BASE_SOURCES.onlineTiles] = onlineTilesSource(input.onlineTiles);
    layers.push(onlineTilesLayer(BASE_LAYERS.onlineTiles, BASE_SOURCES.onlineTiles));
  }
  layers.push({
    id: BASE_LAYERS.graticule,
    type: 'line',
    source: BASE_SOURCES.graticule,
    paint: {
      'line-color': BASE_PALETTE.graticule,
      'line-opacity': 0.45,
      'line-width': 0.6,
      'line-dasharray': [4, 3],
    },
  });
  if (input.graticuleLabels !== false) {
    layers.push({
      id: BASE_LAYERS.graticuleLabels,
      type: 'symbol',
      source: BASE_SOURCES.graticule,
      layout: {
        'symbol-placement': 'line',
        // About one label per line in a laptop-sized view, so labels do not crowd the imagery.
        'symbol-spacing': 1000,
        'text-field': ['get', 'label'],
        'text-font': [...BASE_LABEL_FONT],
        'text-size': 11,
      },
      paint: { 'text-color': BASE_PALETTE.label, 'text-halo-color': BASE_PALETTE.labelHalo, 'text-halo-width': 1.2 },
    });
  }
  return { version: 8, name: 'stratplot offline base', sources, layers };
}
