import { jsPDF } from 'jspdf';
import { InputError } from '../../core/common/InputError';
import { pdfFontRegister } from './pdfFont';

/** Paper sizes the PDFs come in. */
export type Paper = 'a4' | 'letter';

/** A document being written, with its font, page size and a cursor, all in millimetres. */
export interface PdfPage {
  doc: jsPDF;
  font: string;
  pageW: number;
  pageH: number;
  margin: number;
  /** Top of the free space on the current page. */
  y: number;
}

const HEADER_H = 9;
const FOOTER_H = 8;

/** Starts an A4 or Letter portrait document in mm with the embedded font; throws InputError for other papers. */
export function pdfPageStart(paper: Paper, fontBytes: Uint8Array | undefined, title: string): PdfPage {
  if (paper !== 'a4' && paper !== 'letter') throw new InputError(`paper must be "a4" or "letter", got "${String(paper)}"`);
  const doc = new jsPDF({ unit: 'mm', format: paper, orientation: 'portrait', compress: true });
  const font = pdfFontRegister(doc, fontBytes);
  doc.setProperties({ title, creator: 'stratplot' });
  const margin = 12;
  return { doc, font, pageW: doc.internal.pageSize.getWidth(), pageH: doc.internal.pageSize.getHeight(), margin, y: margin + HEADER_H };
}

/** Bottom of the usable area on every page, mm. */
export function pdfPageBottom(pg: PdfPage): number {
  return pg.pageH - pg.margin - FOOTER_H;
}

/** Starts a new page and puts the cursor under the header band. */
export function pdfPageAdd(pg: PdfPage): void {
  pg.doc.addPage();
  pg.y = pg.margin + HEADER_H;
}

/** Moves to a new page unless `heightMm` still fits below the cursor. */
export function pdfPageEnsure(pg: PdfPage, heightMm: number): void {
  if (pg.y + heightMm > pdfPageBottom(pg)) pdfPageAdd(pg);
}

/** Writes wrapped text at the cursor (new pages as needed) and advances it; returns the lines written. */
export function pdfText(
  pg: PdfPage,
  text: string,
  opts: { size?: number; indent?: number; bold?: boolean; gapAfter?: number; bullet?: boolean } = {},
): number {
  const size = opts.size ?? 9;
  const bulletX = pg.margin + (opts.indent ?? 0);
  // Bulleted text hangs: wrapped lines align with the first word, not the bullet.
  const x = opts.bullet ? bulletX + 3 : bulletX;
  const lineH = size * 0.3528 * 1.3;
  pg.doc.setFont(pg.font, opts.bold ? 'bold' : 'normal');
  pg.doc.setFontSize(size);
  const lines: string[] = pg.doc.splitTextToSize(text, pg.pageW - pg.margin - x);
  lines.forEach((line, i) => {
    pdfPageEnsure(pg, lineH);
    if (opts.bullet && i === 0) pg.doc.text('•', bulletX, pg.y + lineH * 0.75);
    pg.doc.text(line, x, pg.y + lineH * 0.75);
    pg.y += lineH;
  });
  pg.y += opts.gapAfter ?? 0;
  return lines.length;
}

/** A heading with a rule under it, kept on the page with at least `keepMm` of what follows. */
export function pdfHeading(pg: PdfPage, text: string, keepMm = 20): void {
  pdfPageEnsure(pg, 9 + keepMm);
  pg.y += 2;
  pdfText(pg, text, { size: 12, bold: true });
  pg.doc.setLineWidth(0.4);
  pg.doc.line(pg.margin, pg.y, pg.pageW - pg.margin, pg.y);
  pg.y += 2.5;
}

/**
 * Writes the running header and "page i of n" footer on every page; call once at the end. With
 * `caution`, every page also carries that one line above the footer (a torn-off page keeps it).
 */
export function pdfPageFrames(pg: PdfPage, left: string, right: string, footer: string, caution?: string): void {
  const { doc } = pg;
  const n = doc.getNumberOfPages();
  for (let i = 1; i <= n; i++) {
    doc.setPage(i);
    doc.setFont(pg.font, 'normal');
    doc.setFontSize(7.5);
    doc.setTextColor(0);
    doc.text(left, pg.margin, pg.margin + 3);
    doc.text(right, pg.pageW - pg.margin, pg.margin + 3, { align: 'right' });
    doc.setLineWidth(0.2);
    doc.line(pg.margin, pg.margin + 4.5, pg.pageW - pg.margin, pg.margin + 4.5);
    const fy = pg.pageH - pg.margin;
    doc.line(pg.margin, fy - (caution ? 6.8 : 4), pg.pageW - pg.margin, fy - (caution ? 6.8 : 4));
    if (caution) {
      doc.setFont(pg.font, 'bold');
      doc.setFontSize(6.5);
      doc.text(caution, pg.margin, fy - 4, { maxWidth: pg.pageW - 2 * pg.margin });
      doc.setFont(pg.font, 'normal');
      doc.setFontSize(7.5);
    }
    doc.text(footer, pg.margin, fy - 0.8);
    doc.text(`Page ${i} of ${n}`, pg.pageW - pg.margin, fy - 0.8, { align: 'right' });
  }
}

/** The finished document as bytes. */
export function pdfPageBytes(pg: PdfPage): Uint8Array {
  return new Uint8Array(pg.doc.output('arraybuffer'));
}
