import type { jsPDF } from 'jspdf';
import type { LocalFrame } from '../../core/geo/localFrame';
import { PLOT_FIELD_STATE_KEYS } from '../../core/field/plotFieldState';
import { PLOT_SYMBOLS } from '../../core/field/plotSymbols';
import { drawPlotSymbol, fillGrey, hatch } from './coverMapSymbols';

/** A rectangle on the page, millimetres from the top-left corner. */
export interface PageBox {
  x: number;
  y: number;
  w: number;
  h: number;
}

/** Ground metres (UTM) to page mm, and the map's centre and scale. */
export interface Projector {
  px(x: number): number;
  py(y: number): number;
  metresPerMm: number;
  cx: number;
  cy: number;
}

/** UTM grid ticks on all four edges, labelled in metres on the bottom and left (none at corners). */
export function drawGridTicks(doc: jsPDF, map: PageBox, stepM: number, p: Projector, font: string): void {
  doc.setFont(font, 'normal');
  doc.setFontSize(5.5);
  doc.setLineWidth(0.2);
  const eMin = p.cx - (map.w / 2) * p.metresPerMm;
  const eMax = p.cx + (map.w / 2) * p.metresPerMm;
  const nMin = p.cy - (map.h / 2) * p.metresPerMm;
  const nMax = p.cy + (map.h / 2) * p.metresPerMm;
  // Labels too near a corner would run into the neighbouring axis' labels: ticks only there.
  for (let e = Math.ceil(eMin / stepM) * stepM; e <= eMax; e += stepM) {
    const x = p.px(e);
    if (x < map.x + 6 || x > map.x + map.w - 6) {
      doc.line(x, map.y, x, map.y + 1.8);
      continue;
    }
    doc.line(x, map.y, x, map.y + 1.8);
    doc.line(x, map.y + map.h, x, map.y + map.h - 1.8);
    doc.text(String(Math.round(e)), x, map.y + map.h + 2.6, { align: 'center' });
  }
  for (let n = Math.ceil(nMin / stepM) * stepM; n <= nMax; n += stepM) {
    const y = p.py(n);
    if (y < map.y + 7 || y > map.y + map.h - 7) {
      doc.line(map.x, y, map.x + 1.8, y);
      continue;
    }
    doc.line(map.x, y, map.x + 1.8, y);
    doc.line(map.x + map.w, y, map.x + map.w - 1.8, y);
    doc.text(String(Math.round(n)), map.x - 1, y, { align: 'center', angle: 90 });
  }
}

/** Angle from grid north to true north at a grid point, degrees clockwise (minus the meridian convergence). */
export function trueNorthFromGridDeg(frame: LocalFrame, cx: number, cy: number): number {
  const [lon, lat] = frame.toLonLat(cx, cy);
  const a = frame.toXY(lon, lat);
  const b = frame.toXY(lon, lat + 0.01);
  return (Math.atan2(b[0] - a[0], b[1] - a[1]) * 180) / Math.PI;
}

/** A half-filled arrow pointing to true north, rotated by `angleDeg` from the page's up. */
export function drawNorthArrow(doc: jsPDF, x: number, y: number, angleDeg: number, font: string): void {
  const a = (angleDeg * Math.PI) / 180;
  const rot = (dx: number, dy: number): [number, number] => [x + dx * Math.cos(a) - dy * Math.sin(a), y + dx * Math.sin(a) + dy * Math.cos(a)];
  const tip = rot(0, -6);
  const left = rot(-2.2, 3);
  const right = rot(2.2, 3);
  const notch = rot(0, 1.6);
  fillGrey(doc, 255);
  doc.rect(x - 4, y - 9.5, 8, 14, 'F');
  doc.setLineWidth(0.25);
  fillGrey(doc, 0);
  doc.triangle(tip[0], tip[1], left[0], left[1], notch[0], notch[1], 'FD');
  fillGrey(doc, 255);
  doc.triangle(tip[0], tip[1], right[0], right[1], notch[0], notch[1], 'FD');
  doc.setFont(font, 'bold');
  doc.setFontSize(7);
  const n = rot(0, -7.2);
  doc.text('N', n[0], n[1], { align: 'center' });
}

/** A four-part alternating black and white scale bar labelled 0, half and full length. */
export function drawScaleBar(doc: jsPDF, x: number, y: number, lengthMm: number, lengthM: number, font: string): void {
  const seg = lengthMm / 4;
  fillGrey(doc, 255);
  doc.rect(x - 1, y - 4.2, lengthMm + 10, 6.2, 'F');
  doc.setLineWidth(0.2);
  for (let i = 0; i < 4; i++) {
    fillGrey(doc, i % 2 ? 255 : 0);
    doc.rect(x + i * seg, y, seg, 1.2, 'FD');
  }
  doc.setFont(font, 'normal');
  doc.setFontSize(5.5);
  const fmt = (m: number) => (lengthM >= 2000 ? `${m / 1000} km` : `${m} m`);
  doc.text('0', x, y - 0.6, { align: 'center' });
  doc.text(fmt(lengthM / 2), x + lengthMm / 2, y - 0.6, { align: 'center' });
  doc.text(fmt(lengthM), x + lengthMm, y - 0.6, { align: 'center' });
}

/** The legend strip: every symbol with its meaning, and the grid's zone, EPSG code and tick step. */
export function drawLegend(doc: jsPDF, b: PageBox, font: string, frame: LocalFrame, gridStepM: number): void {
  doc.setFont(font, 'normal');
  doc.setFontSize(6);
  doc.setLineWidth(0.25);
  const col = b.w / 4;
  const row = (i: number) => b.y + 3.5 + Math.floor(i / 4) * 4;
  const colX = (i: number) => b.x + (i % 4) * col;
  const plotItems: [string, (x: number, y: number) => void][] = PLOT_FIELD_STATE_KEYS.map((k) => [
    PLOT_SYMBOLS[k].short,
    (x: number, y: number) => drawPlotSymbol(doc, k, x + 2, y - 0.8, 1.2),
  ]);
  const items: [string, (x: number, y: number) => void][] = [
    ...plotItems,
    ['Access point', (x, y) => { fillGrey(doc, 0); doc.rect(x + 0.9, y - 1.9, 2.2, 2.2, 'F'); }],
    ['Stratum boundary (code)', (x, y) => { doc.setLineWidth(0.35); doc.line(x, y - 0.8, x + 4, y - 0.8); }],
    ['Cliff edge (ticks)', (x, y) => { doc.setLineWidth(0.6); doc.line(x, y - 0.3, x + 4, y - 0.3); doc.setLineWidth(0.25); for (let t = 0.3; t < 4; t += 1.2) doc.line(x + t, y - 0.3, x + t, y - 1.5); }],
    ['Water (horizontal hatch)', (x, y) => hatch(doc, [[[x, y - 2], [x + 4, y - 2], [x + 4, y], [x, y]]], 0, 0.7)],
    ['Private land (diagonal hatch)', (x, y) => hatch(doc, [[[x, y - 2], [x + 4, y - 2], [x + 4, y], [x, y]]], 45, 1.0)],
    ['Safety buffer (grey edge)', (x, y) => { doc.setLineWidth(0.25); doc.setDrawColor(110, 110, 110); doc.roundedRect(x, y - 2, 4, 2, 1, 1); doc.setDrawColor(0); }],
    ['Hazard', (x, y) => { fillGrey(doc, 255); doc.setLineWidth(0.3); doc.triangle(x + 2, y - 2.2, x + 0.6, y, x + 3.4, y, 'FD'); }],
  ];
  items.forEach(([label, draw], i) => {
    draw(colX(i), row(i));
    doc.setLineWidth(0.25);
    doc.text(label, colX(i) + 5.5, row(i));
  });
  doc.text(
    `Grid: UTM ${frame.utmZone} (EPSG:${frame.epsg}), WGS84, ticks every ${gridStepM} m. Arrow shows true north.`,
    colX(0),
    row(Math.ceil(items.length / 4) * 4),
  );
}
