import type { jsPDF } from 'jspdf';
import { PLOT_CHECK_SYMBOL_MEASURES, PLOT_CHECK_SYMBOLS, type PlotCheckSymbolKey } from '../../core/plotCheck/plotCheckSymbols';
import type { PlotFieldStateKey } from '../../core/field/plotFieldState';
import { PLOT_SYMBOL_MEASURES, PLOT_SYMBOLS } from '../../core/field/plotSymbols';
import type { Exclusion, LonLat } from '../../core/model/types';

/** A ring or path in page millimetres. */
export type XYRing = [number, number][];


// A path stroked with round caps and joins at width 2b covers exactly the ground within b of it
// (the Minkowski sum with a disk), so two passes — grey a little wider, then white — outline the
// union of all buffers without computing it.
/** Outlines the union of every exclusion's safety buffer in grey (see the note above). */
export function drawBuffers(doc: jsPDF, exclusions: readonly Exclusion[], page: (p: LonLat) => [number, number], metresPerMm: number): void {
  const EDGE = 0.25;
  doc.setLineCap('round');
  doc.setLineJoin('round');
  for (const [level, extra] of [[110, EDGE], [255, 0]] as const) {
    doc.setDrawColor(level, level, level);
    fillGrey(doc, level);
    for (const e of exclusions) {
      if (!(e.bufferM > 0)) continue;
      const wMm = (2 * e.bufferM) / metresPerMm + 2 * extra;
      doc.setLineWidth(wMm);
      const g = e.geometry;
      const lines = g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : [];
      const polys = g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [];
      const points = g.type === 'Point' ? [g.coordinates] : g.type === 'MultiPoint' ? g.coordinates : [];
      for (const l of lines) strokeRing(doc, l.map(page), false);
      for (const poly of polys) {
        const rings = poly.map((r) => r.map(page));
        for (const r of rings) strokeRing(doc, r);
        fillRings(doc, rings);
      }
      for (const p of points) {
        const [x, y] = page(p);
        doc.circle(x, y, wMm / 2, 'F');
      }
    }
  }
  doc.setDrawColor(0);
  doc.setLineCap('butt');
  doc.setLineJoin('miter');
}

/** Fills rings as one even–odd path, so holes stay empty. */
export function fillRings(doc: jsPDF, rings: XYRing[]): void {
  for (const r of rings) {
    if (r.length < 3) continue;
    doc.moveTo(r[0][0], r[0][1]);
    for (let i = 1; i < r.length; i++) doc.lineTo(r[i][0], r[i][1]);
    doc.close();
  }
  doc.fillEvenOdd();
}

/** Sets a grey fill, 0 black to 255 white (jsPDF's one-number form is untyped). */
export function fillGrey(doc: jsPDF, level: number): void {
  doc.setFillColor(level, level, level);
}

/** Strokes a path in page mm, closed by default. */
export function strokeRing(doc: jsPDF, r: XYRing, closed = true): void {
  if (r.length < 2) return;
  doc.moveTo(r[0][0], r[0][1]);
  for (let i = 1; i < r.length; i++) doc.lineTo(r[i][0], r[i][1]);
  if (closed) doc.close();
  doc.stroke();
}

/** Text on a white box so labels stay legible over hatching and lines. */
export function haloText(doc: jsPDF, text: string, x: number, y: number, align: 'left' | 'center'): void {
  const w = doc.getTextWidth(text);
  const h = doc.getFontSize() * 0.3528;
  const left = align === 'center' ? x - w / 2 : x;
  fillGrey(doc, 255);
  doc.rect(left - 0.3, y - h * 0.8, w + 0.6, h * 1.05, 'F');
  doc.text(text, x, y, { align });
}

/** Hatches the inside of rings (even–odd) with parallel lines at `angleDeg`, `gapMm` apart. */
export function hatch(doc: jsPDF, rings: XYRing[], angleDeg: number, gapMm: number): void {
  const pts = rings.flat();
  if (pts.length < 3) return;
  doc.saveGraphicsState();
  for (const r of rings) {
    doc.moveTo(r[0][0], r[0][1]);
    for (let i = 1; i < r.length; i++) doc.lineTo(r[i][0], r[i][1]);
    doc.close();
  }
  doc.clipEvenOdd();
  doc.discardPath();
  const xs = pts.map((p) => p[0]);
  const ys = pts.map((p) => p[1]);
  const [x0, x1, y0, y1] = [Math.min(...xs), Math.max(...xs), Math.min(...ys), Math.max(...ys)];
  const diag = Math.hypot(x1 - x0, y1 - y0);
  const a = (angleDeg * Math.PI) / 180;
  const [dx, dy] = [Math.cos(a), Math.sin(a)];
  const [mx, my] = [(x0 + x1) / 2, (y0 + y1) / 2];
  doc.setLineWidth(0.15);
  for (let o = -diag / 2; o <= diag / 2; o += gapMm) {
    const [bx, by] = [mx - dy * o, my + dx * o];
    doc.line(bx - dx * diag, by - dy * diag, bx + dx * diag, by + dy * diag);
  }
  doc.restoreGraphicsState();
}

/** Draws one exclusion by its kind: cliff hachures, water and private hatching, hazard triangles. */
export function drawExclusion(doc: jsPDF, e: Exclusion, page: (p: LonLat) => [number, number]): void {
  const g = e.geometry;
  const lines = g.type === 'LineString' ? [g.coordinates] : g.type === 'MultiLineString' ? g.coordinates : [];
  const polys = g.type === 'Polygon' ? [g.coordinates] : g.type === 'MultiPolygon' ? g.coordinates : [];
  const points = g.type === 'Point' ? [g.coordinates] : g.type === 'MultiPoint' ? g.coordinates : [];
  for (const l of lines) {
    const r = l.map(page);
    if (e.kind === 'cliff') {
      doc.setLineWidth(0.6);
      strokeRing(doc, r, false);
      hachures(doc, r);
    } else {
      doc.setLineWidth(e.kind === 'water' ? 0.5 : 0.4);
      doc.setLineDashPattern(e.kind === 'water' ? [2.2, 0.7] : [1.5, 0.6, 0.3, 0.6], 0);
      strokeRing(doc, r, false);
      doc.setLineDashPattern([], 0);
    }
  }
  for (const poly of polys) {
    const rings = poly.map((r) => r.map(page));
    if (e.kind === 'water') hatch(doc, rings, 0, 0.9);
    else if (e.kind === 'private') hatch(doc, rings, 45, 1.6);
    else if (e.kind === 'hazard') hatch(doc, rings, -45, 1.0);
    else if (e.kind === 'cliff') hatch(doc, rings, 90, 0.8);
    else hatch(doc, rings, 135, 2.2);
    doc.setLineWidth(0.4);
    if (e.kind === 'private') doc.setLineDashPattern([1.5, 0.6, 0.3, 0.6], 0);
    for (const r of rings) strokeRing(doc, r);
    doc.setLineDashPattern([], 0);
  }
  for (const p of points) {
    const [x, y] = page(p);
    doc.setLineWidth(0.3);
    fillGrey(doc, 255);
    doc.triangle(x, y - 1.6, x - 1.5, y + 1, x + 1.5, y + 1, 'FD');
    doc.setFontSize(5);
    doc.text('!', x, y + 0.7, { align: 'center' });
  }
}

/** Short ticks every ~1.5 mm on the left of the line's direction: the usual way to mark a cliff top. */
export function hachures(doc: jsPDF, r: XYRing): void {
  doc.setLineWidth(0.25);
  let carry = 0;
  for (let i = 1; i < r.length; i++) {
    const [x0, y0] = r[i - 1];
    const [x1, y1] = r[i];
    const len = Math.hypot(x1 - x0, y1 - y0);
    if (len === 0) continue;
    const [ux, uy] = [(x1 - x0) / len, (y1 - y0) / len];
    let t = carry;
    for (; t < len; t += 1.5) {
      const [bx, by] = [x0 + ux * t, y0 + uy * t];
      doc.line(bx, by, bx + uy * 1.2, by - ux * 1.2);
    }
    carry = t - len;
  }
}

function fillHex(doc: jsPDF, hex: string): void {
  doc.setFillColor(Number.parseInt(hex.slice(1, 3), 16), Number.parseInt(hex.slice(3, 5), 16), Number.parseInt(hex.slice(5, 7), 16));
}

/**
 * Draws a plot symbol of the shared code (core/plotSymbols) centred on (x, y) with radius `rMm`,
 * with the measures the raster icons use: disc or diamond, solid or open, white centre dot or a
 * cross for a rejected plot, and a white halo.
 */
export function drawPlotSymbol(doc: jsPDF, key: PlotFieldStateKey, x: number, y: number, rMm: number): void {
  const s = PLOT_SYMBOLS[key];
  const m = PLOT_SYMBOL_MEASURES;
  const outer = (s.shape === 'disc' ? m.discR : m.diamondR) * rMm;
  const shape = (size: number) => {
    if (s.shape === 'disc') {
      doc.circle(x, y, size, 'F');
      return;
    }
    // A diamond whose sides are `size` from the centre: its corners are √2 times farther.
    const c = size * Math.SQRT2;
    doc.moveTo(x, y - c);
    doc.lineTo(x + c, y);
    doc.lineTo(x, y + c);
    doc.lineTo(x - c, y);
    doc.close();
    doc.fill();
  };
  fillGrey(doc, 255);
  shape(outer + m.haloW * rMm);
  fillHex(doc, s.ink);
  shape(outer);
  if (s.solid) fillHex(doc, s.fill);
  else fillGrey(doc, 255);
  shape(outer - m.bandW * rMm);
  if (s.centreDot) {
    fillGrey(doc, 255);
    doc.circle(x, y, m.dotR * rMm, 'F');
  }
  if (s.struck) {
    const a = outer * 0.75 * Math.SQRT1_2;
    doc.setDrawColor(Number.parseInt(s.ink.slice(1, 3), 16), Number.parseInt(s.ink.slice(3, 5), 16), Number.parseInt(s.ink.slice(5, 7), 16));
    doc.setLineWidth(m.crossW * rMm);
    doc.line(x - a, y - a, x + a, y + a);
    doc.line(x - a, y + a, x + a, y - a);
    doc.setDrawColor(0);
  }
  fillGrey(doc, 0);
}

/**
 * Draws a checked plot's symbol (core/plotCheckSymbols) centred on (x, y) with radius `rMm`, with the
 * measures the raster icons use: a hexagon with flat top and bottom, solid yellow with a dark
 * band and an exclamation mark when the plot fails, open with a tick when it passes, and a white halo.
 */
export function drawPlotCheckSymbol(doc: jsPDF, key: PlotCheckSymbolKey, x: number, y: number, rMm: number): void {
  const s = PLOT_CHECK_SYMBOLS[key];
  const m = PLOT_CHECK_SYMBOL_MEASURES;
  const hexagon = (apothem: number) => {
    const r = (apothem * rMm) / Math.cos(Math.PI / 6);
    for (let i = 0; i < 6; i++) {
      const a = (i * Math.PI) / 3;
      if (i === 0) doc.moveTo(x + r * Math.cos(a), y + r * Math.sin(a));
      else doc.lineTo(x + r * Math.cos(a), y + r * Math.sin(a));
    }
    doc.close();
    doc.fill();
  };
  fillGrey(doc, 255);
  hexagon(m.apothem + m.haloW);
  fillHex(doc, s.ink);
  hexagon(m.apothem);
  if (s.solid) fillHex(doc, s.fill);
  else fillGrey(doc, 255);
  hexagon(m.apothem - m.bandW);
  fillHex(doc, s.ink);
  if (s.mark === 'exclamation') {
    doc.rect(x - m.barHalfW * rMm, y + m.barTop * rMm, 2 * m.barHalfW * rMm, (m.barBottom - m.barTop) * rMm, 'F');
    doc.circle(x, y + m.dotY * rMm, m.dotR * rMm, 'F');
  } else {
    doc.setDrawColor(Number.parseInt(s.ink.slice(1, 3), 16), Number.parseInt(s.ink.slice(3, 5), 16), Number.parseInt(s.ink.slice(5, 7), 16));
    doc.setLineWidth(2 * m.tickHalfW * rMm);
    doc.lines([[(m.tick[1][0] - m.tick[0][0]) * rMm, (m.tick[1][1] - m.tick[0][1]) * rMm], [(m.tick[2][0] - m.tick[1][0]) * rMm, (m.tick[2][1] - m.tick[1][1]) * rMm]], x + m.tick[0][0] * rMm, y + m.tick[0][1] * rMm, [1, 1], 'S');
    doc.setDrawColor(0);
  }
  fillGrey(doc, 0);
}
