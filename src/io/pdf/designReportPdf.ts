import { autoTable } from 'jspdf-autotable';
import type { DesignSettings, PlotCollection } from '../../core/model/designTypes';
import { FIELD_CAUTION, FIELD_CAUTION_LINE } from '../../core/field/fieldCaution';
import { footprintFormat } from '../../core/design/footprintParse';
import { InputError } from '../../core/common/InputError';
import { plotFieldStates, plotRejectionLines } from '../../core/field/plotFieldState';
import { rngVersionOf, rngVersionText } from '../../core/design/place/rngStreams';
import { coverMapDraw } from './coverMap';
import { type Paper, type PdfPage, pdfHeading, pdfPageBottom, pdfPageBytes, pdfPageEnsure, pdfPageFrames, pdfPageStart, pdfText } from './pdfPageKit';
import { M2_PER_HA } from '../../core/common/units';
import { stratumLabel } from '../../core/field/stratumLabel';
import type { ExportContext } from '../../core/field/exportContext';

/** A table of results to print in the estimates section. */
export interface ReportTable {
  title: string;
  head: string[];
  rows: (string | number)[][];
  notes?: string[];
}

export interface DesignReportOptions {
  paper: Paper;
  /** SHA-256 of the saved plan file, 64 hex digits (see core/sha256). */
  planFileSha256?: string;
  fontBytes?: Uint8Array;
  /** Estimate tables from field results; printed as given. */
  estimates?: unknown;
  /** Printed as the report date (default: now). */
  generatedAt?: Date;
}

/** What the estimates cover, printed in every report (our wording). */
export const INFERENCE_STATEMENT =
  'Estimates from this design apply to the usable area of each stratum only: the mapped stratum less ' +
  'exclusions, their safety buffers and any edge buffer. Ground left out that way had no chance of ' +
  'selection, so the plots say nothing about it; report it separately if it matters.';

const SETTING_LABELS: [keyof DesignSettings, string][] = [
  ['plots', 'Primary plots requested'],
  ['allocation', 'Allocation'],
  ['shareBasis', 'Share of plots by'],
  ['minPerStratum', 'Minimum plots per stratum'],
  ['sd', 'Pilot standard deviations'],
  ['cost', 'Relative cost per plot'],
  ['targetHalfwidth', 'Target 95 % CI half-width'],
  ['pilotMean', 'Pilot mean'],
  ['spacingM', 'Minimum spacing (m)'],
  ['footprint', 'Plot footprint'],
  ['edgeBufferM', 'Edge buffer (m)'],
  ['reservePerStratum', 'Reserve plots per stratum'],
  ['method', 'Placement'],
  ['gridSpacingM', 'Grid spacing (m)'],
  ['gridAngleDeg', 'Grid angle (°)'],
  ['baseline', 'Transect baseline'],
  ['transectIntervalM', 'Transect interval (m)'],
  ['quadratIntervalM', 'Quadrat interval (m)'],
  ['redistributeShortfall', 'Move shortfall to strata with room'],
  ['seed', 'Random seed'],
];

function settingText(value: unknown, key?: keyof DesignSettings): string {
  if (value === null || value === undefined) return '—';
  if (key === 'footprint') return footprintFormat(value as DesignSettings['footprint']);
  if (key === 'targetHalfwidth') {
    const t = value as NonNullable<DesignSettings['targetHalfwidth']>;
    return t.relative ? `${+(t.value * 100).toFixed(4)} % of the pilot mean` : String(t.value);
  }
  if (typeof value === 'boolean') return value ? 'yes' : 'no';
  if (typeof value === 'number' || typeof value === 'string') return String(value);
  if (Array.isArray(value)) return value.length ? `${value.length} vertices` : '—';
  const entries = Object.entries(value as Record<string, unknown>);
  return entries.length ? entries.map(([k, v]) => `${k}: ${typeof v === 'object' ? JSON.stringify(v) : v}`).join('; ') : '—';
}

/** Checks the estimates option and names what is wrong, by table index. */
export function reportTablesParse(estimates: unknown): ReportTable[] {
  if (estimates === undefined || estimates === null) return [];
  if (!Array.isArray(estimates)) throw new InputError('estimates must be a list of tables { title, head, rows, notes? }');
  return estimates.map((t, i) => {
    const o = t as Partial<ReportTable>;
    if (!o || typeof o.title !== 'string') throw new InputError(`estimates table ${i}: title must be text`);
    if (!Array.isArray(o.head) || !o.head.every((h) => typeof h === 'string')) throw new InputError(`estimates table ${i} ("${o.title}"): head must be a list of column names`);
    if (!Array.isArray(o.rows)) throw new InputError(`estimates table ${i} ("${o.title}"): rows must be a list`);
    o.rows.forEach((r, j) => {
      if (!Array.isArray(r) || r.length !== o.head!.length || !r.every((c) => typeof c === 'string' || typeof c === 'number')) {
        throw new InputError(`estimates table ${i} ("${o.title}"), row ${j}: needs ${o.head!.length} text or number cells`);
      }
    });
    if (o.notes !== undefined && (!Array.isArray(o.notes) || !o.notes.every((n) => typeof n === 'string'))) {
      throw new InputError(`estimates table ${i} ("${o.title}"): notes must be a list of text`);
    }
    return { title: o.title, head: o.head, rows: o.rows, notes: o.notes };
  });
}

/**
 * The design report: site map with the safety caution beside it on page 1, strata table by
 * current names and codes (mapped and usable area, share, plots, reserves), method and every
 * setting (the footprint written as the CLI takes it, e.g. square:20), seed, plan-file SHA-256,
 * software version, the field decisions recorded (rejected plots with reason, time and
 * replacement), warnings, the statement of what estimates cover, and any estimate tables. Every
 * page carries the one-line caution in its footer.
 * @returns the PDF as bytes.
 * @throws InputError for an unknown paper, a hash that is not 64 hex digits, or malformed estimates.
 */
export function designReportPdf(context: ExportContext, options: DesignReportOptions): Uint8Array {
  const hash = options.planFileSha256;
  if (hash !== undefined && !/^[0-9a-f]{64}$/i.test(hash)) {
    throw new InputError(`plan-file SHA-256 must be 64 hexadecimal digits, got "${hash.slice(0, 80)}"`);
  }
  const tables = reportTablesParse(options.estimates);
  const { site, field: collection } = context;
  const d = collection.design;
  const siteName = site?.name ?? 'Unnamed site';
  const pg = pdfPageStart(options.paper, options.fontBytes, `Design report — ${siteName}`);
  const when = (options.generatedAt ?? new Date()).toISOString().slice(0, 10);

  pdfText(pg, `Design report: ${siteName}`, { size: 16, bold: true, gapAfter: 1 });
  pdfText(pg, `${d.software.name} ${d.software.version} · ${when} · seed ${d.seed}, generator version ${rngVersionOf(d.settings)} · UTM ${d.crs.utm_zone} (EPSG:${d.crs.epsg})`, { size: 9, gapAfter: 2 });
  const mapH = Math.min(150, (pdfPageBottom(pg) - pg.y) * 0.62);
  const cautionW = 44;
  const mapW = pg.pageW - 2 * pg.margin - cautionW - 3;
  coverMapDraw(pg.doc, { x: pg.margin, y: pg.y, w: mapW, h: mapH }, { collection, site, frame: context.frame, font: pg.font });
  drawCautionBox(pg, pg.margin + mapW + 3, pg.y, cautionW, mapH);
  pg.y += mapH + 3;

  pdfHeading(pg, 'Strata and allocation', 30);
  const ha = (m2: number) => (m2 / M2_PER_HA).toFixed(2);
  const rows = d.allocation.map((r) => {
    const code = context.codeOfStratum.get(r.stratum);
    return [stratumLabel(r.stratum, code), ha(r.mapped_m2), ha(r.usable_m2), `${(r.share * 100).toFixed(1)} %`, r.plots, r.reserve, r.capacity ?? '—'];
  });
  const sum = (f: (r: (typeof d.allocation)[number]) => number) => d.allocation.reduce((s, r) => s + f(r), 0);
  table(pg, ['Stratum', 'Mapped ha', 'Usable ha', 'Share', 'Plots', 'Reserves', 'Capacity'], rows, [
    'Total', ha(sum((r) => r.mapped_m2)), ha(sum((r) => r.usable_m2)), `${(sum((r) => r.share) * 100).toFixed(1)} %`, sum((r) => r.plots), sum((r) => r.reserve), '',
  ]);
  pdfText(pg, 'Areas are ellipsoidal (WGS84) areas of the mapped and usable ground; share is each stratum’s part of the basis named below.', { size: 7.5, gapAfter: 2 });

  pdfHeading(pg, 'Method and settings', 30);
  table(pg, ['Setting', 'Value'], SETTING_LABELS.map(([k, label]) => [label, settingText(d.settings[k], k)]));
  pdfHeading(pg, 'Reproducing this design', 25);
  table(pg, ['Item', 'Value'], [
    ['Random seed', String(d.seed)],
    ['Random generator', rngVersionText(rngVersionOf(d.settings))],
    ['Plan file SHA-256', hash ? hash.toLowerCase() : 'not given (save the plan file and print the report from it to record its hash)'],
    ['Software', `${d.software.name} ${d.software.version}`],
    ['Coordinate frame', `UTM ${d.crs.utm_zone}, EPSG:${d.crs.epsg}, WGS84`],
    ['Plots in this file', plotCountsText(collection)],
  ]);

  pdfHeading(pg, 'Field decisions', 15);
  const decisions = plotRejectionLines(collection);
  if (decisions.length) for (const line of decisions) pdfText(pg, line, { size: 8.5, indent: 2, gapAfter: 0.5, bullet: true });
  else pdfText(pg, 'None recorded: every primary plot is to be visited.', { size: 8.5 });
  pg.y += 2;

  pdfHeading(pg, 'Warnings', 15);
  if (d.warnings.length) for (const w of d.warnings) pdfText(pg, w, { size: 8.5, indent: 2, gapAfter: 0.5, bullet: true });
  else pdfText(pg, 'None.', { size: 8.5 });
  pg.y += 2;

  pdfHeading(pg, 'What the estimates cover', 20);
  pdfText(pg, INFERENCE_STATEMENT, { size: 9, gapAfter: 1 });
  for (const s of d.statements) pdfText(pg, s, { size: 8.5, indent: 2, gapAfter: 0.5, bullet: true });
  pg.y += 2;

  pdfHeading(pg, 'Estimates', 20);
  if (!tables.length) pdfText(pg, 'No field results yet: estimates are printed here once results are entered.', { size: 9 });
  for (const t of tables) {
    // Keep a short table with its title and notes; long ones flow across pages.
    pdfPageEnsure(pg, Math.min(10 + (t.rows.length + 1) * 5.5 + (t.notes?.length ?? 0) * 4, 80));
    pdfText(pg, t.title, { size: 10, bold: true, gapAfter: 1 });
    table(pg, t.head, t.rows);
    for (const n of t.notes ?? []) pdfText(pg, n, { size: 7.5, gapAfter: 0.5 });
    pg.y += 2;
  }
  pdfPageFrames(pg, `${siteName} — design report`, when, `${d.software.name} ${d.software.version} · seed ${d.seed}${hash ? ` · plan ${hash.slice(0, 12).toLowerCase()}…` : ''}`, FIELD_CAUTION_LINE);
  return pdfPageBytes(pg);
}

function plotCountsText(collection: PlotCollection): string {
  const states = [...plotFieldStates(collection.features.map((f) => f.properties)).values()];
  const n = (k: string) => states.filter((s) => s.key === k).length;
  const parts = [`${n('primary')} primary`, `${n('reserve')} reserve${n('reserve') === 1 ? '' : 's'} waiting`];
  if (n('promoted')) parts.push(`${n('promoted')} promoted reserve${n('promoted') === 1 ? '' : 's'}`);
  if (n('rejected')) parts.push(`${n('rejected')} rejected`);
  return parts.join(', ');
}

/** The caution, framed, in a column beside the page-1 map. */
function drawCautionBox(pg: PdfPage, x: number, y: number, w: number, h: number): void {
  const { doc } = pg;
  doc.setLineWidth(0.6);
  doc.setDrawColor(0);
  doc.setFont(pg.font, 'bold');
  doc.setFontSize(9);
  doc.text('Caution', x + 3, y + 6);
  doc.setFont(pg.font, 'normal');
  doc.setFontSize(8);
  const body = FIELD_CAUTION.replace(/^Caution:\s*/, '');
  const lines: string[] = doc.splitTextToSize(body.charAt(0).toUpperCase() + body.slice(1), w - 6);
  lines.forEach((l, i) => {
    doc.text(l, x + 3, y + 11 + i * 3.6);
  });
  doc.rect(x, y, w, Math.min(h, 14 + lines.length * 3.6));
}

function table(pg: PdfPage, head: string[], body: (string | number)[][], foot?: (string | number)[]): void {
  autoTable(pg.doc, {
    columnStyles: head.length === 2 ? { 0: { cellWidth: 62 } } : {},
    startY: pg.y,
    head: [head],
    body,
    foot: foot ? [foot] : undefined,
    theme: 'grid',
    margin: { left: pg.margin, right: pg.margin, top: pg.margin + 9, bottom: pg.margin + 8 },
    styles: { font: pg.font, fontStyle: 'normal', fontSize: 8, cellPadding: 1.2, textColor: 0, lineColor: 0, lineWidth: 0.15 },
    headStyles: { fillColor: 225, textColor: 0 },
    footStyles: { fillColor: 245, textColor: 0 },
  });
  const last = (pg.doc as unknown as { lastAutoTable?: { finalY: number } }).lastAutoTable;
  pg.y = (last?.finalY ?? pg.y) + 2;
}
