import { crewBriefing } from '../../core/field/crewBriefing';
import type { PlotProperties } from '../../core/model/designTypes';
import { FIELD_CAUTION, FIELD_CAUTION_LINE } from '../../core/field/fieldCaution';
import { InputError } from '../../core/common/InputError';
import { type PlotFieldState, fieldTimeText, plotFieldStates, plotFieldStateText, plotRejectionLines } from '../../core/field/plotFieldState';
import { magneticDeclination } from '../../core/geo/magneticDeclination';
import { NOTES_SEPARATOR, } from '../../core/field/plotsAnnotate';
import { walkingOrder } from '../../core/field/walkingOrder';
import { autoTable } from 'jspdf-autotable';
import { decimalDegreesText, declinationText, degreesMinutesText, mgrsSpacedText, utmText } from '../common/coordinateText';
import { coverMapDraw } from './coverMap';
import { fillGrey } from './coverMapSymbols';
import { type Paper, type PdfPage, pdfPageAdd, pdfPageBottom, pdfPageBytes, pdfPageEnsure, pdfPageFrames, pdfPageStart, pdfText } from './pdfPageKit';
import { stratumLabel } from '../../core/field/stratumLabel';
import type { ExportContext } from '../../core/field/exportContext';

export interface FieldSheetsOptions {
  paper: Paper;
  siteName?: string;
  /** A TTF to embed instead of the bundled DejaVu Sans Condensed. */
  fontBytes?: Uint8Array;
  /** Largest walk per day, metres, to split the suggested walking order into days. */
  dayBudgetM?: number;
}

const RECORD_FIELDS = ['Date, time', 'Observer(s)', 'Reached? yes / no, why not', 'Marker left / found', 'Total cover %', 'Photo numbers, directions'];

/**
 * Printable field sheets: a cover map, the crew briefing (rejected plots first), the walking order
 * over the active plots (primaries not rejected and promoted reserves), then one block per plot
 * with its field state, stratum name and code, coordinates (decimal degrees, degrees and minutes,
 * UTM, MGRS), the walk from the access point (geodesic distance, true and magnetic bearing with
 * the model), safety notes, and blank recording fields. A promoted reserve prints as an active plot
 * that replaces the rejected one; a rejected plot prints struck out with its reason, time and
 * replacement and no recording fields. Every page carries the one-line caution in its footer.
 * Black-and-white readable, A4 or Letter. Stratum names are the plots' own (name them first, see
 * plotCollectionNamed).
 * @param site the mapped site for the map, navigation and notes; null prints plots and briefing only.
 * @returns the PDF file as bytes.
 * @throws InputError for an unknown paper or access point, or a collection without plots.
 */
export function fieldSheetsPdf(context: ExportContext, options: FieldSheetsOptions): Uint8Array {
  const { site, named: collection, surveyDate: date } = context;
  if (!collection.features.length) throw new InputError('the plot collection has no plots to print field sheets for');
  const siteName = options.siteName ?? site?.name ?? 'Unnamed site';
  const plots = context.annotated.features.map((f) => f.properties);
  const pg = pdfPageStart(options.paper, options.fontBytes, `Field sheets — ${siteName}`);
  const dateText = date.toISOString().slice(0, 10);
  const states = plotFieldStates(plots);
  const stateOf = (p: PlotProperties) => states.get(p.plot_id)!;
  const count = (k: PlotFieldState['key']) => plots.filter((p) => stateOf(p).key === k).length;
  const decisions = plotRejectionLines(collection);

  pdfText(pg, `Field sheets: ${siteName}`, { size: 16, bold: true, gapAfter: 1 });
  const promoted = count('promoted');
  pdfText(
    pg,
    `Survey date ${dateText} · ${count('primary') + promoted} plots to visit (${count('primary')} primary${promoted ? `, ${promoted} promoted reserve${promoted > 1 ? 's' : ''}` : ''}) · ${count('reserve')} reserves waiting${count('rejected') ? ` · ${count('rejected')} rejected` : ''} · design seed ${collection.design.seed}`,
    { size: 9, gapAfter: 2 },
  );
  coverMapDraw(pg.doc, { x: pg.margin, y: pg.y, w: pg.pageW - 2 * pg.margin, h: pdfPageBottom(pg) - pg.y - 22 }, { collection, site, frame: context.frame, font: pg.font });
  pg.y = pdfPageBottom(pg) - 20;
  if (decisions.length) pdfText(pg, `Do not visit: ${decisions.join(' ')}`, { size: 8, bold: true });
  pdfText(pg, 'Reserves replace a plot that cannot be reached safely: take the reserve of the same stratum with the lowest rank not yet used, and record why.', { size: 8 });
  pdfText(pg, FIELD_CAUTION, { size: 8 });

  pdfPageAdd(pg);
  const access = site?.access ?? [];
  const declAt = access.find((a) => a.id === context.accessPointId) ?? access[0];
  const decl = declAt ? magneticDeclination([declAt.lat, declAt.lon], 0, date) : null;
  const briefing = crewBriefing(
    { name: siteName, exclusions: site?.exclusions ?? [], access },
    {
      surveyDate: date,
      declinationText: decl ? `${declinationText(decl.declinationDeg)} at ${declAt!.name} (${decl.model}, epoch ${decl.epoch.toFixed(1)}, for ${decl.decimalYear.toFixed(2)})` : undefined,
      fieldDecisions: decisions,
    },
  );
  drawBriefing(pg, briefing, decl?.warning ?? null);
  if (declAt) drawWalkingOrder(pg, plots.filter((p) => stateOf(p).active), count('promoted') > 0, declAt, decl?.declinationDeg ?? 0, options.dayBudgetM);

  pdfPageAdd(pg);
  const sorted = [...plots].sort((a, b) => a.stratum.localeCompare(b.stratum) || (a.role === b.role ? a.rank - b.rank : a.role === 'primary' ? -1 : 1));
  const accessNames = new Map(access.map((a) => [a.id, `${a.name} (${a.id})`]));
  for (const p of sorted) {
    const code = p.stratum_code ?? context.codeOfStratum.get(p.stratum);
    const stratum = stratumLabel(p.stratum, code);
    const state = stateOf(p);
    if (state.key === 'rejected') drawRejectedBlock(pg, p, state, stratum);
    else drawPlotBlock(pg, p, state, stratum, accessNames.get(p.access_point ?? '') ?? p.access_point ?? '', states);
  }
  pdfPageFrames(
    pg,
    `${siteName} — field sheets`,
    `Survey date ${dateText}`,
    `stratplot ${collection.design.software.version} · seed ${collection.design.seed} · UTM ${collection.design.crs.utm_zone} (EPSG:${collection.design.crs.epsg})`,
    FIELD_CAUTION_LINE,
  );
  return pdfPageBytes(pg);
}

function drawWalkingOrder(pg: PdfPage, active: PlotProperties[], withPromoted: boolean, start: { id: string; name: string; lon: number; lat: number }, declinationDeg: number, dayBudgetM: number | undefined): void {
  const stops = active.map((p) => ({ id: p.plot_id, lon: p.lon, lat: p.lat }));
  if (!stops.length) return;
  const tour = walkingOrder({ id: start.id, lon: start.lon, lat: start.lat }, stops, { declinationDeg, dayBudgetM });
  pdfPageAdd(pg);
  pdfText(pg, `Suggested walking order from ${start.name} (${start.id})`, { size: 13, bold: true, gapAfter: 1 });
  pdfText(
    pg,
    `Plots to visit only (${withPromoted ? 'primaries not rejected and promoted reserves' : 'primary plots'}; rejected plots and waiting reserves are left out), ${(tour.days.reduce((t, d) => t + d.distanceM, 0) / 1000).toFixed(2)} km of straight legs in ${tour.days.length} day(s), there and back (nearest neighbour, then 2-opt). ` +
      'Straight legs are not routes: check every leg against the map and the notes, and go around water, cliffs and private land.',
    { size: 8.5, gapAfter: 2 },
  );
  const body: (string | number)[][] = [];
  tour.days.forEach((day, d) => {
    day.legs.forEach((l, i) => {
      body.push([
        tour.days.length > 1 ? `Day ${d + 1}` : '',
        i + 1,
        `${l.fromId} → ${l.toId}`,
        l.distanceM >= 1000 ? `${(l.distanceM / 1000).toFixed(2)} km` : `${Math.round(l.distanceM)} m`,
        `${l.bearingTrueDeg.toFixed(1)}°`,
        l.bearingMagDeg === null ? '' : `${l.bearingMagDeg.toFixed(1)}°`,
      ]);
    });
    if (day.overBudget) body.push(['', '', `Day ${d + 1} is longer than the daily budget on its own`, '', '', '']);
  });
  autoTable(pg.doc, {
    startY: pg.y,
    head: [['Day', 'Leg', 'From → to', 'Distance', 'True', 'Magnetic']],
    body,
    theme: 'grid',
    margin: { left: pg.margin, right: pg.margin, top: pg.margin + 9, bottom: pg.margin + 8 },
    styles: { font: pg.font, fontStyle: 'normal', fontSize: 8, cellPadding: 1, textColor: 0, lineColor: 0, lineWidth: 0.15 },
    headStyles: { fillColor: 225, textColor: 0 },
  });
}

function drawBriefing(pg: PdfPage, b: ReturnType<typeof crewBriefing>, modelWarning: string | null): void {
  pdfText(pg, b.title, { size: 14, bold: true, gapAfter: 1 });
  if (modelWarning) pdfText(pg, `Compass warning: ${modelWarning}.`, { size: 8.5, gapAfter: 1 });
  for (const s of b.sections) {
    pdfPageEnsure(pg, 14);
    pdfText(pg, s.heading, { size: 10, bold: true, gapAfter: 0.5 });
    for (const line of s.lines) pdfText(pg, line, { size: 8.5, indent: 3, gapAfter: 0.4, bullet: true });
    pg.y += 1.2;
  }
  pdfPageEnsure(pg, b.fields.length * 7 + 4);
  const { doc } = pg;
  doc.setLineWidth(0.2);
  for (const f of b.fields) {
    pdfText(pg, f.label, { size: 8.5 });
    doc.line(pg.margin + 62, pg.y - 1, pg.pageW - pg.margin, pg.y - 1);
    pg.y += 2.6;
  }
  pg.y += 2;
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(9);
  const lines: string[] = doc.splitTextToSize(b.governingStatement, pg.pageW - 2 * pg.margin - 6);
  const h = lines.length * 4.2 + 4;
  pdfPageEnsure(pg, h);
  doc.setLineWidth(0.6);
  doc.rect(pg.margin, pg.y, pg.pageW - 2 * pg.margin, h);
  lines.forEach((l, i) => {
    doc.text(l, pg.margin + 3, pg.y + 5 + i * 4.2);
  });
  pg.y += h + 2;
}

function stateHeading(p: PlotProperties, state: PlotFieldState, states: ReadonlyMap<string, PlotFieldState>): string {
  if (state.key === 'primary') return `Primary plot, rank ${p.rank}`;
  if (state.key === 'promoted') {
    const gone = states.get(state.replaces);
    return `PROMOTED RESERVE, rank ${p.rank}: sample it, replaces ${state.replaces}${gone?.key === 'rejected' ? ` (${gone.reason})` : ''}`;
  }
  return `RESERVE, rank ${p.rank}, waiting: use only to replace a rejected plot`;
}

/** A rejected plot: struck out, with why, when and what replaced it, and no recording fields. */
function drawRejectedBlock(pg: PdfPage, p: PlotProperties, state: Extract<PlotFieldState, { key: 'rejected' }>, stratum: string): void {
  const { doc } = pg;
  const w = pg.pageW - 2 * pg.margin;
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(8.5);
  const note = plotFieldStateText(p, state).note;
  const lines: string[] = doc.splitTextToSize(note, w - 6);
  const height = 9 + 3 + lines.length * 4 + 5 + 5;
  pdfPageEnsure(pg, height);
  const top = pg.y;
  doc.setLineWidth(0.5);
  doc.setLineDashPattern([1.2, 0.8], 0);
  doc.rect(pg.margin, top, w, height - 3);
  doc.setLineDashPattern([], 0);
  fillGrey(doc, 225);
  doc.rect(pg.margin, top, w, 9, 'F');
  doc.setFont(pg.font, 'bold');
  doc.setFontSize(14);
  doc.text(p.plot_id, pg.margin + 2.5, top + 6.5);
  // Struck out: a rule through the id, so nobody mistakes it for a plot to visit.
  doc.setLineWidth(0.6);
  doc.line(pg.margin + 1.5, top + 5, pg.margin + 3.5 + doc.getTextWidth(p.plot_id), top + 5);
  doc.setFontSize(9);
  doc.text(`REJECTED: do not visit${state.atIso ? ` · ${fieldTimeText(state.atIso)}` : ''} · ${stratum}`, pg.margin + w - 2.5, top + 6.2, { align: 'right' });
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(8.5);
  let y = top + 13;
  for (const line of lines) {
    doc.text(line, pg.margin + 3, y);
    y += 4;
  }
  doc.setFontSize(7);
  doc.text(`Position, for reference only: ${decimalDegreesText(p.lon, p.lat)} · MGRS ${mgrsSpacedText(p.mgrs)}`, pg.margin + 3, y + 1);
  pg.y = top + height;
}

function drawPlotBlock(pg: PdfPage, p: PlotProperties, state: PlotFieldState, stratumLabel: string, accessName: string, states: ReadonlyMap<string, PlotFieldState>): void {
  const { doc } = pg;
  const w = pg.pageW - 2 * pg.margin;
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(7.5);
  const notes: [boolean, string][] = p.notes
    ? p.notes.split(NOTES_SEPARATOR).flatMap((n) => (doc.splitTextToSize(n, w - 10) as string[]).map((t, i): [boolean, string] => [i === 0, t]))
    : [[false, 'None from the map.']];
  const height = 12 + 23.5 + 4 + notes.length * 3.3 + Math.ceil(RECORD_FIELDS.length / 2) * 6 + 18;
  pdfPageEnsure(pg, height);
  const top = pg.y;
  const active = state.active;
  doc.setLineWidth(0.5);
  doc.rect(pg.margin, top, w, height - 3);
  fillGrey(doc, active ? 0 : 255);
  doc.rect(pg.margin, top, w, 9, active ? 'F' : 'S');
  doc.setTextColor(active ? 255 : 0);
  doc.setFont(pg.font, 'bold');
  doc.setFontSize(14);
  doc.text(p.plot_id, pg.margin + 2.5, top + 6.5);
  const idW = doc.getTextWidth(p.plot_id);
  doc.setFontSize(9);
  const heading = `${stateHeading(p, state, states)} · ${stratumLabel}`;
  let size = 9;
  // Long headings (a promoted reserve names what it replaces and why) shrink rather than run over the id.
  while (size > 6 && doc.getTextWidth(heading) > w - idW - 10) doc.setFontSize((size -= 0.5));
  doc.text(heading, pg.margin + w - 2.5, top + 6.2, { align: 'right' });
  doc.setTextColor(0);

  const colW = w / 2;
  const rows: [string, string][] = [
    ['Lat, lon (WGS84)', decimalDegreesText(p.lon, p.lat)],
    ['Degrees, minutes', `${degreesMinutesText(p.lat, 'lat')}  ${degreesMinutesText(p.lon, 'lon')}`],
    ['UTM (WGS84)', utmText(p.utm_zone, p.easting, p.northing)],
    ['MGRS', mgrsSpacedText(p.mgrs)],
  ];
  const nav: [string, string][] =
    p.distance_m !== undefined
      ? [
          ['From access point', accessName],
          ['Distance (geodesic)', `${p.distance_m >= 1000 ? `${(p.distance_m / 1000).toFixed(2)} km` : `${Math.round(p.distance_m)} m`} straight line`],
          ['Bearing true / magnetic', `${p.bearing_true_deg!.toFixed(1)}° T  /  ${p.bearing_mag_deg!.toFixed(1)}° M`],
          ['Declination', `${declinationText(p.declination_deg ?? 0)} (${p.mag_model ?? ''})`],
        ]
      : [['Navigation', 'no access point mapped']];
  const rowTop = top + 13;
  const cell = (x: number, i: number, [k, v]: [string, string]) => {
    doc.setFont(pg.font, 'normal');
    doc.setFontSize(7);
    doc.text(k, x, rowTop + i * 5.2);
    // Shrink long values (access point names, model text) to their column rather than overrun it.
    const room = colW - 28 - 4;
    let size = 9;
    doc.setFontSize(size);
    while (size > 6 && doc.getTextWidth(v) > room) doc.setFontSize((size -= 0.5));
    doc.text(v, x + 28, rowTop + i * 5.2);
  };
  rows.forEach((r, i) => {
    cell(pg.margin + 2.5, i, r);
  });
  nav.forEach((r, i) => {
    cell(pg.margin + colW + 2.5, i, r);
  });
  let y = top + 35.5;
  doc.setFont(pg.font, 'bold');
  doc.setFontSize(8);
  doc.text('Safety and access notes', pg.margin + 2.5, y);
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(7.5);
  y += 3.6;
  for (const [first, line] of notes) {
    if (first) doc.text('•', pg.margin + 4, y);
    doc.text(line, pg.margin + 7, y);
    y += 3.3;
  }
  y += 2;
  doc.setLineWidth(0.2);
  doc.setFontSize(8);
  // Two columns of write-in lines keep three plots to a page on A4 and Letter alike.
  const half = (w - 5) / 2;
  RECORD_FIELDS.forEach((f, i) => {
    const x = pg.margin + 2.5 + (i % 2) * (half + 2.5);
    const fy = y + Math.floor(i / 2) * 6;
    doc.text(f, x, fy + 3);
    doc.line(x + doc.getTextWidth(f) + 2, fy + 3.4, x + half - 1, fy + 3.4);
  });
  y += Math.ceil(RECORD_FIELDS.length / 2) * 6 + 0.5;
  doc.rect(pg.margin + 2.5, y, w - 5, 11);
  doc.text('Comments', pg.margin + 4, y + 3.5);
  pg.y = top + height;
}
