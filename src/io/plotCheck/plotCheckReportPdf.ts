import { autoTable } from 'jspdf-autotable';
import type { PlotCollection } from '../../core/model/designTypes';
import { FIELD_CAUTION, FIELD_CAUTION_LINE } from '../../core/field/fieldCaution';
import { PLOT_CHECK_SYMBOLS } from '../../core/plotCheck/plotCheckSymbols';
import { plotCheckCountsText, plotCheckSettingsText } from '../../core/plotCheck/plotCheckSettingsText';
import type { PlotsCheckReport } from '../../core/plotCheck/plotCheckTypes';
import { plotCheckRecordsBySeverity } from '../../core/plotCheck/plotsCheck';
import type { Site } from '../../core/model/types';
import { EXCLUSION_KINDS } from '../../core/model/types';
import { coverMapDraw } from '../pdf/coverMap';
import { drawPlotCheckSymbol } from '../pdf/coverMapSymbols';
import type { PlotCheckReportMeta } from './plotCheckReportCsv';
import { type Paper, type PdfPage, pdfHeading, pdfPageBottom, pdfPageBytes, pdfPageFrames, pdfPageStart, pdfText } from '../pdf/pdfPageKit';
import { M2_PER_HA } from '../../core/common/units';
import { stratumLabel } from '../../core/field/stratumLabel';

/** Options of {@link plotCheckReportPdf}. */
export interface PlotCheckReportPdfOptions {
  paper: Paper;
  fontBytes?: Uint8Array;
  /** The planner's own design, drawn under the checked plots when given. */
  design?: PlotCollection | null;
}

const m1 = (v: number | undefined | null): string => (v === undefined || v === null ? '—' : v.toFixed(1));

/**
 * The check report to sign: page 1 the site map with every checked plot (failing ones in the
 * warning symbol, passing ones open, each labelled) and the safety caution beside it, the counts,
 * the settings, the date and the files checked; then the plots most serious first with their
 * problems as sentences, the strata against a proportional allocation, the notes on the set as a
 * sample, the distances (each kind of exclusion, nearest plot, route from the nearest access point
 * with true and magnetic bearings) and lines to sign. Every page carries the caution in its footer.
 * @returns the PDF as bytes. @throws InputError for an unknown paper.
 */
export function plotCheckReportPdf(report: PlotsCheckReport, site: Site, meta: PlotCheckReportMeta, options: PlotCheckReportPdfOptions): Uint8Array {
  const pg = pdfPageStart(options.paper, options.fontBytes, `Plot check — ${meta.siteName}`);
  const when = (meta.generatedAt ?? new Date()).toISOString().slice(0, 10);
  pdfText(pg, `Plot check: ${meta.siteName}`, { size: 16, bold: true, gapAfter: 1 });
  pdfText(pg, `${meta.software} · checked ${when} · ${plotCheckCountsText(report)}`, { size: 9, gapAfter: 2 });
  const mapH = Math.min(140, (pdfPageBottom(pg) - pg.y) * 0.55);
  const cautionW = 44;
  const mapW = pg.pageW - 2 * pg.margin - cautionW - 3;
  const marks = plotCheckRecordsBySeverity(report.plots)
    .reverse()
    .map((r) => ({ lon: r.lon, lat: r.lat, label: r.id, draw: (doc: typeof pg.doc, x: number, y: number) => drawPlotCheckSymbol(doc, r.ok ? 'pass' : 'fail', x, y, 1.5) }));
  coverMapDraw(pg.doc, { x: pg.margin, y: pg.y, w: mapW, h: mapH }, { collection: options.design ?? null, site, font: pg.font, marks });
  sideBox(pg, pg.margin + mapW + 3, pg.y, cautionW);
  pg.y += mapH + 3;

  pdfHeading(pg, 'What was checked', 25);
  table(pg, ['Item', 'Value'], [
    ['Files', meta.files.join('\n')],
    ['Settings', plotCheckSettingsText(report)],
    ['Date of the check', when],
    ['Result', plotCheckCountsText(report)],
  ]);

  pdfHeading(pg, 'Plots, most serious first', 30);
  const sorted = plotCheckRecordsBySeverity(report.plots);
  table(
    pg,
    ['Plot', 'Where in the file', 'Stratum', 'Result', 'Problems'],
    sorted.map((r) => [r.id, r.where, r.stratum ? r.stratum.code : r.holeIn ? `hole in ${r.holeIn.code}` : 'none', r.ok ? 'pass' : 'FAIL', r.problems.map((p) => p.text).join('\n') || '—']),
    { 4: { cellWidth: 95 } },
    (row) => !sorted[row]?.ok,
  );

  pdfHeading(pg, 'Strata and a proportional allocation', 30);
  table(
    pg,
    ['Stratum', 'Usable ha', 'Sample plots', 'Passing', 'Proportional'],
    report.strata.map((s) => [stratumLabel(s.name, s.code), (s.usableM2 / M2_PER_HA).toFixed(2), s.plots, s.passing, s.proportional]),
  );
  pdfText(pg, `Proportional: the ${report.counts.counted} sample plots shared in proportion to each stratum's usable area (mapped area less buffered exclusions), largest remainder.`, { size: 7.5, gapAfter: 2 });

  pdfHeading(pg, 'The set as a sample', 15);
  for (const n of report.notes.length ? report.notes : ['Every stratum holds a plot and no plot lies on excluded ground.']) pdfText(pg, n, { size: 8.5, indent: 2, gapAfter: 0.5, bullet: true });
  for (const w of report.warnings) pdfText(pg, `Note: ${w}.`, { size: 8, indent: 2, gapAfter: 0.5, bullet: true });
  pg.y += 2;

  pdfHeading(pg, 'Distances (metres) and routes', 30);
  const kinds = EXCLUSION_KINDS.filter((k) => report.plots.some((r) => r.nearestByKind[k]));
  table(
    pg,
    ['Plot', ...kinds.map((k) => `Nearest ${k}`), 'Nearest plot', 'From access', 'Bearing true / mag °'],
    sorted.map((r) => [
      r.id,
      ...kinds.map((k) => m1(r.nearestByKind[k]?.distanceM)),
      r.nearestPlot ? `${r.nearestPlot.id} ${m1(r.nearestPlot.distanceM)}` : '—',
      r.access ? `${r.access.accessPointName} ${m1(r.access.distanceM)}` : '—',
      r.access ? `${r.access.bearingTrueDeg.toFixed(1)} / ${r.access.bearingMagDeg.toFixed(1)}` : '—',
    ]),
  );
  pdfText(pg, 'Distances to exclusions are from the plot centre to the mapped feature (0 inside a polygon); buffers are measured from the same line.', { size: 7.5, gapAfter: 2 });

  pdfHeading(pg, 'Checked and approved', 40);
  for (const line of ['Checked by (name and role)', 'Signature', 'Date', 'Conditions of approval']) {
    pdfText(pg, line, { size: 9, gapAfter: 5 });
    pg.doc.setLineWidth(0.2);
    pg.doc.line(pg.margin + 48, pg.y - 5.5, pg.pageW - pg.margin, pg.y - 5.5);
  }
  pdfPageFrames(pg, `${meta.siteName} — plot check`, when, `${meta.software} · ${plotCheckCountsText(report)}`, FIELD_CAUTION_LINE);
  return pdfPageBytes(pg);
}

/** The symbol key and the caution, framed, beside the page-1 map. */
function sideBox(pg: PdfPage, x: number, y: number, w: number): void {
  const { doc } = pg;
  let at = y + 5;
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(7.5);
  for (const key of ['fail', 'pass'] as const) {
    drawPlotCheckSymbol(doc, key, x + 4, at, 1.8);
    const lines: string[] = doc.splitTextToSize(PLOT_CHECK_SYMBOLS[key].short, w - 10);
    lines.forEach((l, i) => {
      doc.text(l, x + 8, at + 1 + i * 3.2);
    });
    at += 4 + lines.length * 3.2;
  }
  at += 2;
  doc.setFont(pg.font, 'bold');
  doc.setFontSize(9);
  doc.text('Caution', x + 3, at);
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(8);
  const body = FIELD_CAUTION.replace(/^Caution:\s*/, '');
  const lines: string[] = doc.splitTextToSize(body.charAt(0).toUpperCase() + body.slice(1), w - 6);
  lines.forEach((l, i) => {
    doc.text(l, x + 3, at + 5 + i * 3.6);
  });
  doc.setLineWidth(0.6);
  doc.setDrawColor(0);
  doc.rect(x, y, w, at - y + 8 + lines.length * 3.6);
}

function table(pg: PdfPage, head: string[], body: (string | number)[][], columnStyles: Record<number, { cellWidth: number }> = {}, warn?: (row: number) => boolean): void {
  autoTable(pg.doc, {
    columnStyles: head.length === 2 ? { 0: { cellWidth: 40 } } : columnStyles,
    startY: pg.y,
    head: [head],
    body,
    theme: 'grid',
    margin: { left: pg.margin, right: pg.margin, top: pg.margin + 9, bottom: pg.margin + 8 },
    styles: { font: pg.font, fontStyle: 'normal', fontSize: 7.5, cellPadding: 1.1, textColor: 0, lineColor: 0, lineWidth: 0.15 },
    headStyles: { fillColor: 225, textColor: 0 },
    didParseCell: (data) => {
      // Failing rows are tinted with the warning yellow; the word FAIL keeps them apart in black and white.
      if (warn && data.section === 'body' && warn(data.row.index)) data.cell.styles.fillColor = [255, 247, 178];
    },
  });
  const last = (pg.doc as unknown as { lastAutoTable?: { finalY: number } }).lastAutoTable;
  pg.y = (last?.finalY ?? pg.y) + 2;
}
