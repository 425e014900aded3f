import type { jsPDF } from 'jspdf';
import type { PlotCollection } from '../../core/model/designTypes';
import type { LocalFrame } from '../../core/geo/localFrame';
import { designFrame } from '../../core/field/designFrame';
import type { Exclusion, LonLat, Site } from '../../core/model/types';
import { drawGridTicks, drawLegend, drawNorthArrow, drawScaleBar, type PageBox, trueNorthFromGridDeg } from './coverMapFurniture';
import { niceStepM } from '../../core/common/niceStepM';
import { plotFieldStates } from '../../core/field/plotFieldState';
import { drawBuffers, drawExclusion, drawPlotSymbol, fillGrey, haloText, strokeRing, type XYRing } from './coverMapSymbols';

export type { PageBox };

/** A point drawn over the map by the caller (e.g. plots checked from another file), with a label. */
export interface CoverMapMark {
  lon: number;
  lat: number;
  label: string;
  /** Draws the symbol centred on (x, y), page mm. */
  draw(doc: jsPDF, x: number, y: number): void;
}

/** How the map was laid out, for callers and tests. */
export interface CoverMapLayout {
  frame: LocalFrame | null;
  /** Metres on the ground per millimetre on paper (UTM grid metres). */
  metresPerMm: number;
  gridStepM: number;
  scaleBarM: number;
  /** Angle from grid north to true north at the map centre, degrees clockwise. */
  trueNorthDeg: number;
}

/** What {@link coverMapDraw} draws. */
export interface CoverMapContent {
  collection: PlotCollection | null;
  site: Site | null;
  /** The export's frame (designFrame); worked out from the design and site when not given. */
  frame?: LocalFrame | null;
  /** Font family registered by pdfFontRegister. */
  font: string;
  marks?: readonly CoverMapMark[];
}

const LEGEND_H = 20;
const TICK_MARGIN = 5;

/**
 * Draws the site map into a PDF box with vector drawing, readable in black and white: strata
 * outlines with their codes, exclusions by line style and hatching (cliff hachures, water
 * horizontal hatch, private land diagonal hatch and dash-dot edge, hazard triangles), safety
 * buffers outlined in grey, plots in the shared symbol code of their field state (primary,
 * reserve, promoted, rejected struck through), each labelled, access points as squares,
 * a scale bar, a true-north arrow, UTM grid ticks at round metres, and a legend strip below.
 * Positions are projected to the site's UTM zone (north up = grid north). `marks` are drawn over
 * the plots, labelled, and kept inside the map's extent.
 * @param box where to draw, mm; the legend strip takes the bottom 20 mm.
 */
export function coverMapDraw(doc: jsPDF, box: PageBox, content: CoverMapContent): CoverMapLayout {
  const { collection, site, font, marks = [] } = content;
  const plots = collection?.features ?? [];
  const frame = content.frame === undefined ? designFrame(collection, site) : content.frame;
  const map: PageBox = { x: box.x + TICK_MARGIN, y: box.y, w: box.w - TICK_MARGIN, h: box.h - LEGEND_H - TICK_MARGIN };
  doc.setDrawColor(0);
  doc.setTextColor(0);
  doc.setLineDashPattern([], 0);
  doc.setLineWidth(0.3);
  doc.rect(map.x, map.y, map.w, map.h);
  if (!frame) {
    doc.setFont(font, 'normal');
    doc.setFontSize(9);
    doc.text('Nothing mapped yet: no strata, plots or access points.', map.x + 4, map.y + 8);
    return { frame: null, metresPerMm: 0, gridStepM: 0, scaleBarM: 0, trueNorthDeg: 0 };
  }
  const xy = (p: LonLat): [number, number] => {
    const v = frame.toXY(p[0], p[1]);
    return [v[0], v[1]];
  };
  const strataRings = (site?.parts ?? []).map((part) => ({
    stratum: part.stratum,
    polys: (part.geometry.type === 'Polygon' ? [part.geometry.coordinates] : part.geometry.coordinates).map((poly) => poly.map((r) => r.map(xy))),
  }));
  const exclusions = site?.exclusions ?? [];
  const plotXY = plots.map((f) => ({ p: f.properties, at: xy([f.properties.lon, f.properties.lat]) }));
  const accessXY = (site?.access ?? []).map((a) => ({ a, at: xy([a.lon, a.lat]) }));

  let [minX, minY, maxX, maxY] = [Infinity, Infinity, -Infinity, -Infinity];
  const grow = (p: readonly number[]) => {
    minX = Math.min(minX, p[0]);
    maxX = Math.max(maxX, p[0]);
    minY = Math.min(minY, p[1]);
    maxY = Math.max(maxY, p[1]);
  };
  for (const s of strataRings) for (const poly of s.polys) for (const q of poly[0]) grow(q);
  for (const e of exclusions) {
    for (const path of geometryPaths(e, xy)) {
      for (const q of path) {
        grow([q[0] - e.bufferM, q[1] - e.bufferM]);
        grow([q[0] + e.bufferM, q[1] + e.bufferM]);
      }
    }
  }
  for (const p of plotXY) grow(p.at);
  const markXY = marks.map((k) => ({ k, at: xy([k.lon, k.lat]) }));
  for (const k of markXY) grow(k.at);
  for (const a of accessXY) grow(a.at);
  const spanX = Math.max(maxX - minX, 50);
  const spanY = Math.max(maxY - minY, 50);
  const metresPerMm = Math.max((spanX * 1.08) / map.w, (spanY * 1.08) / map.h);
  const cx = (minX + maxX) / 2;
  const cy = (minY + maxY) / 2;
  const px = (x: number) => map.x + map.w / 2 + (x - cx) / metresPerMm;
  const py = (y: number) => map.y + map.h / 2 - (y - cy) / metresPerMm;
  const toPage = (r: XYRing) => r.map(([x, y]) => [px(x), py(y)] as [number, number]);

  doc.saveGraphicsState();
  doc.rect(map.x, map.y, map.w, map.h, null);
  doc.clip();
  doc.discardPath();

  // Buffers first so the features they surround draw over them.
  drawBuffers(doc, exclusions, (p) => {
    const [x, y] = xy(p);
    return [px(x), py(y)];
  }, metresPerMm);

  doc.setLineWidth(0.35);
  for (const s of strataRings) for (const poly of s.polys) for (const r of poly) strokeRing(doc, toPage(r));

  for (const e of exclusions) drawExclusion(doc, e, (p) => {
    const [x, y] = xy(p);
    return [px(x), py(y)];
  });

  doc.setFont(font, 'normal');
  doc.setFontSize(6.5);
  const codeOf = new Map((site?.strata ?? []).map((s) => [s.key, s.code]));
  for (const s of strataRings) {
    const shell = s.polys.reduce((best, poly) => (ringAreaAbs(poly[0]) > ringAreaAbs(best) ? poly[0] : best), s.polys[0][0]);
    const [lx, ly] = labelPoint(shell);
    haloText(doc, codeOf.get(s.stratum) ?? s.stratum, px(lx), py(ly), 'center');
  }

  doc.setLineWidth(0.25);
  const placed: PageBox[] = [];
  const states = plotFieldStates(plots.map((f) => f.properties));
  // Rejected plots first, so an active plot nearby is never hidden under one.
  const drawOrder = [...plotXY].sort((a, b) => Number(states.get(b.p.plot_id)?.key === 'rejected') - Number(states.get(a.p.plot_id)?.key === 'rejected'));
  for (const { p, at } of drawOrder) {
    const [x, y] = [px(at[0]), py(at[1])];
    drawPlotSymbol(doc, states.get(p.plot_id)?.key ?? (p.role === 'reserve' ? 'reserve' : 'primary'), x, y, 1.2);
    placed.push({ x: x - 1.1, y: y - 1.1, w: 2.2, h: 2.2 });
  }
  for (const { k, at } of markXY) {
    const [x, y] = [px(at[0]), py(at[1])];
    k.draw(doc, x, y);
    placed.push({ x: x - 1.4, y: y - 1.4, w: 2.8, h: 2.8 });
  }
  doc.setFontSize(6.5);
  for (const { a, at } of accessXY) {
    const [x, y] = [px(at[0]), py(at[1])];
    fillGrey(doc, 0);
    doc.rect(x - 1.1, y - 1.1, 2.2, 2.2, 'F');
    fillGrey(doc, 255);
    doc.rect(x - 0.45, y - 0.45, 0.9, 0.9, 'F');
    placeLabel(doc, `${a.name} (${a.id})`, x, y, 1.8, map, placed);
  }
  doc.setFontSize(5.5);
  for (const { p, at } of plotXY) placeLabel(doc, p.plot_id, px(at[0]), py(at[1]), 1.3, map, placed);
  for (const { k, at } of markXY) placeLabel(doc, k.label, px(at[0]), py(at[1]), 1.6, map, placed);
  doc.restoreGraphicsState();
  doc.setLineDashPattern([], 0);
  doc.setLineWidth(0.3);
  doc.rect(map.x, map.y, map.w, map.h);

  const gridStepM = niceStepM((map.w * metresPerMm) / 6);
  drawGridTicks(doc, map, gridStepM, { px, py, metresPerMm, cx, cy }, font);
  const trueNorthDeg = trueNorthFromGridDeg(frame, cx, cy);
  drawNorthArrow(doc, map.x + map.w - 9, map.y + 11, trueNorthDeg, font);
  const scaleBarM = niceStepM((map.w * metresPerMm) / 5);
  drawScaleBar(doc, map.x + 3, map.y + map.h - 5, scaleBarM / metresPerMm, scaleBarM, font);
  drawLegend(doc, { x: map.x, y: map.y + map.h + TICK_MARGIN, w: map.w, h: LEGEND_H }, font, frame, gridStepM);
  return { frame, metresPerMm, gridStepM, scaleBarM, trueNorthDeg };
}

// Tries right, left, above and below the symbol; takes the first spot free of earlier labels and
// inside the map, else the least-bad one (right), so every plot keeps a readable id.
function placeLabel(doc: jsPDF, text: string, x: number, y: number, gap: number, map: PageBox, placed: PageBox[]): void {
  const w = doc.getTextWidth(text);
  const h = doc.getFontSize() * 0.3528;
  const spots: [number, number][] = [
    [x + gap, y + h * 0.35],
    [x - gap - w, y + h * 0.35],
    [x - w / 2, y - gap],
    [x - w / 2, y + gap + h * 0.8],
    [x + gap, y - gap],
    [x + gap, y + gap + h * 0.8],
  ];
  const boxOf = ([lx, ly]: [number, number]): PageBox => ({ x: lx - 0.3, y: ly - h * 0.8, w: w + 0.6, h: h * 1.05 });
  const fits = (b: PageBox) =>
    b.x >= map.x && b.x + b.w <= map.x + map.w && b.y >= map.y && b.y + b.h <= map.y + map.h &&
    !placed.some((o) => b.x < o.x + o.w && o.x < b.x + b.w && b.y < o.y + o.h && o.y < b.y + b.h);
  const spot = spots.find((s) => fits(boxOf(s))) ?? spots.find((s) => { const b = boxOf(s); return b.x >= map.x && b.x + b.w <= map.x + map.w; }) ?? spots[0];
  placed.push(boxOf(spot));
  haloText(doc, text, spot[0], spot[1], 'left');
}

function geometryPaths(e: Exclusion, xy: (p: LonLat) => [number, number]): XYRing[] {
  const g = e.geometry;
  switch (g.type) {
    case 'Point':
      return [[xy(g.coordinates)]];
    case 'MultiPoint':
      return g.coordinates.map((c) => [xy(c)]);
    case 'LineString':
      return [g.coordinates.map(xy)];
    case 'MultiLineString':
      return g.coordinates.map((l) => l.map(xy));
    case 'Polygon':
      return g.coordinates.map((r) => r.map(xy));
    case 'MultiPolygon':
      return g.coordinates.flatMap((p) => p.map((r) => r.map(xy)));
  }
}

function ringAreaAbs(r: XYRing): number {
  let a = 0;
  for (let i = 0, j = r.length - 1; i < r.length; j = i++) a += r[j][0] * r[i][1] - r[i][0] * r[j][1];
  return Math.abs(a / 2);
}

// Area centroid of the shell; good enough for a label on the convex-ish strata of field maps.
function labelPoint(r: XYRing): [number, number] {
  let a = 0;
  let x = 0;
  let y = 0;
  const [ox, oy] = r[0];
  for (let i = 0, j = r.length - 1; i < r.length; j = i++) {
    const c = (r[j][0] - ox) * (r[i][1] - oy) - (r[i][0] - ox) * (r[j][1] - oy);
    a += c;
    x += (r[j][0] + r[i][0] - 2 * ox) * c;
    y += (r[j][1] + r[i][1] - 2 * oy) * c;
  }
  return a === 0 ? r[0] : [ox + x / (3 * a), oy + y / (3 * a)];
}
