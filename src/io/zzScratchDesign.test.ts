import { it } from 'vitest';
import { writeFileSync } from 'node:fs';
import { designRun } from '../core/designRun';
import { designSettingsDefault } from '../core/designSettingsDefault';
import { fieldSheetsPdf } from './fieldSheetsPdf';
import { designReportPdf } from './designReportPdf';
import { fieldKitSite } from './fixtures/fieldKitSample';
it('real design', () => {
  const site = fieldKitSite();
  let t = performance.now();
  const plots = designRun(site, designSettingsDefault({ plots: 40, reservePerStratum: 2, spacingM: 50, seed: 7 }));
  console.log('design', performance.now() - t, plots.features.length);
  t = performance.now();
  writeFileSync('/tmp/real-sheets.pdf', fieldSheetsPdf(plots, site, { paper: 'a4', surveyDate: new Date(Date.UTC(2026, 3, 1)) }));
  writeFileSync('/tmp/real-report.pdf', designReportPdf(plots, site, { paper: 'letter' }));
  console.log('pdf', performance.now() - t);
});
