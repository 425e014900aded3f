import { execFileSync } from 'node:child_process';
import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { sha256Hex } from '../../core/common/sha256';
import { designReportPdf, INFERENCE_STATEMENT } from './designReportPdf';
import { FIELD_KIT_RENAMED, fieldKitPlots, fieldKitSite } from '../fixtures/fieldKitSample';
import { exportContext } from '../../core/field/exportContext';

function extract(bytes: Uint8Array): { text: string; dir: string; file: string } {
  const dir = mkdtempSync(join(tmpdir(), 'stratplot-report-'));
  const file = join(dir, 'report.pdf');
  writeFileSync(file, bytes);
  // pdftotext (Debian poppler-utils) is the outside reader.
  return { text: execFileSync('pdftotext', [file, '-'], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'] }).replace(/\s+/g, ' '), dir, file };
}

const estimates = [
  {
    title: 'Total cover % by stratum (invented numbers)',
    head: ['Stratum', 'n', 'Mean', 'SE'],
    rows: [
      ['Ngā otaota', 3, 41.2, 5.1],
      ['Солончак', 3, 12.5, 2.2],
    ],
    notes: ['Invented example values.'],
  },
];

describe('designReportPdf', () => {
  for (const paper of ['a4', 'letter'] as const) {
    it(`prints strata, settings, seed, hash, warnings, the inference statement and estimates on ${paper}`, () => {
      const site = fieldKitSite();
      const plots = fieldKitPlots(site);
      const hash = sha256Hex(JSON.stringify({ invented: 'plan' }));
      const bytes = designReportPdf(exportContext(plots, site, { annotate: false }), { paper, planFileSha256: hash, estimates, generatedAt: new Date(Date.UTC(2026, 2, 15)) });
      const { text, dir, file } = extract(bytes);
      for (const name of Object.values(FIELD_KIT_RENAMED)) expect(text).toContain(name);
      expect(text).toContain(hash);
      expect(text).toContain('20260315');
      expect(text).toContain('seed 20260315, generator version 3');
      expect(text).toContain('random generator version 3 (seed expanded by splitmix64');
      expect(text).toContain(INFERENCE_STATEMENT.slice(0, 60));
      expect(text).toContain('Total cover % by stratum (invented numbers)');
      expect(text).toContain('41.2');
      expect(text).toContain('Example warning');
      expect(text).toContain('Minimum plots per stratum');
      execFileSync('pdftoppm', ['-png', '-r', '50', file, join(dir, 'page')]);
      expect(readdirSync(dir).filter((f) => f.endsWith('.png')).length).toBeGreaterThanOrEqual(2);
      if (process.env.STRATPLOT_KEEP_PDF) writeFileSync(join(tmpdir(), `design-report-${paper}.pdf`), bytes);
    });
  }

  it('says there are no estimates yet when none are given, and works without a site', () => {
    const plots = fieldKitPlots(fieldKitSite(), 1);
    const { text } = extract(designReportPdf(exportContext(plots, null, { annotate: false }), { paper: 'a4' }));
    expect(text).toMatch(/No field results yet/);
    expect(text).toMatch(/not given/);
  });

  it('names the malformed part of the estimates and a bad hash', () => {
    const plots = fieldKitPlots(fieldKitSite(), 1);
    expect(() => designReportPdf(exportContext(plots, null, { annotate: false }), { paper: 'a4', planFileSha256: 'abc' })).toThrow(/64 hexadecimal digits/);
    const bad = [{ title: 'T', head: ['a', 'b'], rows: [[1]] }];
    expect(() => designReportPdf(exportContext(plots, null, { annotate: false }), { paper: 'a4', estimates: bad })).toThrow(/table 0 \("T"\), row 0: needs 2/);
    expect(() => designReportPdf(exportContext(plots, null, { annotate: false }), { paper: 'a4', estimates: 'x' })).toThrow(/list of tables/);
  });

  it('flags a plot file saved before generator versions were recorded as made with version 1', () => {
    const site = fieldKitSite();
    const plots = fieldKitPlots(site);
    const old = { ...plots, design: { ...plots.design, settings: { ...plots.design.settings, rngVersion: undefined } } };
    const { text } = extract(designReportPdf(exportContext(old, site, { annotate: false }), { paper: 'a4', generatedAt: new Date(Date.UTC(2026, 2, 15)) }));
    expect(text).toContain('seed 20260315, generator version 1');
    expect(text).toContain('random generator version 1 (old streams');
  });
});
