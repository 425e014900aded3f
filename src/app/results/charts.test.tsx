import { renderToStaticMarkup } from 'react-dom/server';
import { describe, expect, it } from 'vitest';
import { estimateFromResults } from '../../core/results/estimateFromResults';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { parseResultsCsv } from '../../io/results/parseResultsCsv';
import { chartTicks } from './chartScale';
import { MeansChart, stratumMeanBars } from './MeansChart';
import { allocationShares, ShareChart } from './ShareChart';

// Invented plot file (not a real site); point plots, so no finite-population correction.
const plots = plotCollectionInvented(
  [
    { key: 'Coastal heath', code: 'HEA', primaries: 6, reserves: 0, mappedM2: 60_000, usableM2: 60_000 },
    { key: 'Saltmarsh', code: 'SAL', primaries: 2, reserves: 0, mappedM2: 20_000, usableM2: 20_000 },
  ],
  { shape: 'point' },
);
const table = parseResultsCsv('invented.csv', 'plot_id,height\nHEA-01,10\nHEA-02,12\nHEA-03,14\nHEA-04,16\nHEA-05,18\nHEA-06,20\nSAL-01,3\nSAL-02,5\n');
const report = estimateFromResults(plots, table, { value: 'height', kind: 'measure', collapse: false });

describe('results charts', () => {
  it('draws each stratum’s 95 % interval with t on n − 1 df', () => {
    const [heath] = stratumMeanBars(report);
    // Heath: mean 15, s = √14, n = 6: half-width t(0.975, 5) × √14/√6, t = 2.571 (docs/references.md §7, standard t tables).
    const half = 2.5706 * Math.sqrt(14 / 6);
    expect(heath.mean).toBe(15);
    expect(heath.ci95?.[0]).toBeCloseTo(15 - half, 3);
    expect(heath.ci95?.[1]).toBeCloseTo(15 + half, 3);
  });

  it('clips a cover interval at 0 %, the least cover can be', () => {
    const cover = estimateFromResults(plots, parseResultsCsv('invented.csv', 'plot_id,cover\nHEA-01,1\nHEA-02,9\nHEA-03,2\nHEA-04,3\nHEA-05,1\nHEA-06,2\nSAL-01,0\nSAL-02,40\n'), {
      value: 'cover',
      kind: 'cover',
      collapse: false,
    });
    const [, salt] = stratumMeanBars(cover);
    // Saltmarsh: mean 20, s = √800, n = 2: 20 ± 12.706 × 20 by hand (t(0.975, 1) = 12.706, docs/references.md §7), clipped to 0–100.
    expect(salt.ci95).toEqual([0, 100]);
  });

  it('gives the means chart an accessible name and a description with the numbers', () => {
    const html = renderToStaticMarkup(<MeansChart report={report} />);
    expect(html).toContain('role="img"');
    expect(html).toContain('<title');
    expect(html).toContain('Mean height by stratum with 95 % intervals');
    expect(html).toContain('Coastal heath: mean 15.00');
    expect(html).toContain('stratified mean 12.25');
    expect(html).not.toMatch(/style=/);
  });

  it('sets plot share against area share for each stratum', () => {
    const rows = [
      { stratum: 'A', mapped_m2: 1, usable_m2: 1, share: 0.75, plots: 6, reserve: 0, capacity: null },
      { stratum: 'B', mapped_m2: 1, usable_m2: 1, share: 0.25, plots: 4, reserve: 0, capacity: null },
    ];
    expect(allocationShares(rows)).toEqual([
      { stratum: 'A', plotShare: 0.6, areaShare: 0.75 },
      { stratum: 'B', plotShare: 0.4, areaShare: 0.25 },
    ]);
    const html = renderToStaticMarkup(<ShareChart rows={rows} basis="usable" />);
    expect(html).toContain('A: 75.0 % of the usable area, 60.0 % of the plots');
    expect(html).toContain('<pattern');
  });

  it('picks round ticks that cover the values', () => {
    expect(chartTicks(3, 19)).toEqual([0, 5, 10, 15, 20]);
    expect(chartTicks(0.12, 0.87)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
    expect(chartTicks(5, 5)).toEqual([4.4, 4.6, 4.8, 5, 5.2, 5.4, 5.6]);
  });
});
