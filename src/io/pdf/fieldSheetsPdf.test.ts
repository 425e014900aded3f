import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { fieldSheetsPdf } from './fieldSheetsPdf';
import { FIELD_KIT_RENAMED, fieldKitPlots, fieldKitSite } from '../fixtures/fieldKitSample';
import { exportContext } from '../../core/field/exportContext';

const date = new Date(Date.UTC(2026, 2, 15));

// Text as poppler's pdftotext (Debian poppler-utils) extracts it: an outside reader of our PDFs.
function pdfText(bytes: Uint8Array): { text: string; dir: string; file: string } {
  const dir = mkdtempSync(join(tmpdir(), 'stratplot-sheets-'));
  const file = join(dir, 'sheets.pdf');
  writeFileSync(file, bytes);
  return { text: execFileSync('pdftotext', ['-layout', file, '-'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }), dir, file };
}

describe('fieldSheetsPdf', () => {
  for (const paper of ['a4', 'letter'] as const) {
    it(`prints every plot id, renders, and is ${paper} sized`, () => {
      const site = fieldKitSite();
      const plots = fieldKitPlots(site);
      const bytes = fieldSheetsPdf(exportContext(plots, site, { surveyDate: date, annotate: { accessPointId: 'access-north' } }), { paper, dayBudgetM: 6000 });
      const { text, dir, file } = pdfText(bytes);
      for (const f of plots.features) expect(text).toContain(f.properties.plot_id);
      for (const name of Object.values(FIELD_KIT_RENAMED)) expect(text).toContain(name);
      expect(text).toMatch(/does not replace local regulations/);
      expect(text).toMatch(/WMM-2025/);
      expect(text).toMatch(/Suggested walking order from North car park/);
      expect(text).toMatch(/Landholder permission required before entry|landholder permission required before entry/);
      execFileSync('pdftoppm', ['-png', '-r', '50', '-f', '1', '-l', '3', file, join(dir, 'page')]);
      expect(readdirSync(dir).filter((f) => f.endsWith('.png')).length).toBe(3);
      const info = execFileSync('pdfinfo', [file], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] });
      // ISO 216 A4 is 595 × 842 pt; ANSI Letter 612 × 792 pt.
      expect(info).toMatch(paper === 'a4' ? /Page size:\s+595\.2\d? x 841\.8\d?/ : /Page size:\s+612 x 792/);
      if (process.env.STRATPLOT_KEEP_PDF) writeFileSync(join(tmpdir(), `field-sheets-${paper}.pdf`), bytes);
    });
  }

  it('prints plots without a site, saying there is no navigation', () => {
    const plots = fieldKitPlots(fieldKitSite(), 1);
    const { text } = pdfText(fieldSheetsPdf(exportContext(plots, null, { surveyDate: date }), { paper: 'a4', siteName: 'Invented' }));
    expect(text).toContain(plots.features[0].properties.plot_id);
    expect(text).toMatch(/no access point mapped/);
  });

  it('refuses an empty collection and an unknown paper with a clear message', () => {
    const site = fieldKitSite();
    const plots = fieldKitPlots(site);
    expect(() => fieldSheetsPdf(exportContext({ ...plots, features: [] }, site), { paper: 'a4' })).toThrow(/no plots/);
    expect(() => fieldSheetsPdf(exportContext(plots, site), { paper: 'a3' as 'a4' })).toThrow(/paper must be "a4" or "letter"/);
  });
});
