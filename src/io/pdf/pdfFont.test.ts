import { execFileSync } from 'node:child_process';
import { readFileSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { jsPDF } from 'jspdf';
import { describe, expect, it } from 'vitest';
import { DEJAVU_SANS_CONDENSED_BASE64 } from './fonts/dejavuSansCondensedBase64';
import { bytesToBase64, PDF_FONT_FAMILY, pdfFontRegister } from './pdfFont';

const TTF = readFileSync(join(import.meta.dirname, 'fonts', 'DejaVuSansCondensed.ttf'));

function extract(doc: jsPDF): string {
  const file = join(mkdtempSync(join(tmpdir(), 'stratplot-font-')), 'f.pdf');
  writeFileSync(file, new Uint8Array(doc.output('arraybuffer')));
  return execFileSync('pdftotext', [file, '-'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
}

describe('pdfFontRegister', () => {
  it('ships a base64 copy identical to the TTF beside it, under 1 MB', () => {
    expect(TTF.length).toBeLessThan(1_000_000);
    expect(DEJAVU_SANS_CONDENSED_BASE64).toBe(TTF.toString('base64'));
    expect(bytesToBase64(new Uint8Array(TTF))).toBe(TTF.toString('base64'));
  });

  it('makes macron, Cyrillic and Greek stratum names extractable from the PDF', () => {
    const doc = new jsPDF({ unit: 'mm', format: 'a4' });
    expect(pdfFontRegister(doc)).toBe(PDF_FONT_FAMILY);
    doc.text('Ngā otaota · Солончак · Λιβάδι · 34° 26′ S', 20, 20);
    // Read back by poppler's pdftotext (Debian poppler-utils).
    expect(extract(doc)).toContain('Ngā otaota · Солончак · Λιβάδι · 34° 26′ S');
  });

  it('embeds a font given as bytes', () => {
    const doc = new jsPDF({ unit: 'mm', format: 'a4' });
    pdfFontRegister(doc, new Uint8Array(TTF));
    doc.text('Ngā repo', 20, 20);
    expect(extract(doc)).toContain('Ngā repo');
  });
});
