import { STRATPLOT_VERSION } from '../../core/common/version';
import { downloadFile, fileSafeName } from '../downloadFile';
import { plannerStore } from '../plannerStoreInstance';
import { notify } from '../usePlanner';
import { plotCheckStore } from './plotCheckStoreInstance';

/**
 * Writes the current check as a PDF (map, tables, caution, date, files checked, lines to sign) or
 * a CSV to the downloads, for the land manager's records. The writers load only when asked for.
 */
export async function plotCheckReportDownload(kind: 'pdf' | 'csv'): Promise<void> {
  const { report, reportSite, fileName, showDesign } = plotCheckStore.getState();
  const { result } = plannerStore.getState();
  if (!report || !reportSite || !fileName) return;
  const s = reportSite;
  const meta = {
    siteName: s.name,
    files: [`plots: ${fileName}`, `site: the plan "${s.name}" in the planner (${s.strata.length} strata, ${s.exclusions.length} exclusions, ${s.access.length} access points)`],
    software: `stratplot ${STRATPLOT_VERSION}`,
  };
  try {
    const base = `${fileSafeName(s.name, 'site')}-plot-check`;
    if (kind === 'csv') {
      const { plotCheckReportCsv } = await import('../../io/plotCheck/plotCheckReportCsv');
      downloadFile(`${base}.csv`, plotCheckReportCsv(report, meta), 'text/csv');
    } else {
      const { plotCheckReportPdf } = await import('../../io/plotCheck/plotCheckReportPdf');
      downloadFile(`${base}.pdf`, plotCheckReportPdf(report, s, meta, { paper: 'a4', design: showDesign ? result : null }), 'application/pdf');
    }
    notify('info', `${base}.${kind} written to your downloads.`);
  } catch (e) {
    notify('error', (e as Error).message);
  }
}
