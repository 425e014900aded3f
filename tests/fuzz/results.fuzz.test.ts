import fc from 'fast-check';
import { describe, it } from 'vitest';
import { plotCollectionInvented } from '../../src/core/field/plotCollectionInvented';
import { FUZZ_SEED, fuzzCli, fuzzDir, fuzzReport, fuzzRuns, fuzzTally } from './fuzzHarness';

// Results CSV cells: an invented plot file of two strata and a results table whose value cells are
// plain numbers, blanks, or text a spreadsheet may leave behind (hexadecimal, 1e400, formulas,
// full-width digits, decimal commas...), with done/blank/rejected statuses. `stratplot estimate`
// must exit 0 with the stratified mean worked out here by hand (Cochran 1977, eq. 5.1:
// ȳ_st = Σ W_h ȳ_h with W_h the usable-area share), or exit 2 with one line; a cell that is not a
// plain number on a measured row must never be read as one.

const plots = plotCollectionInvented([
  { key: 'Heath (invented)', code: 'HEA', primaries: 4, reserves: 0, mappedM2: 60_000, usableM2: 50_000 },
  { key: 'Dune (invented)', code: 'DUN', primaries: 3, reserves: 0, mappedM2: 40_000, usableM2: 30_000 },
]);
const ids = plots.features.map((f) => ({ id: f.properties.plot_id, stratum: f.properties.stratum }));
const usable = new Map(plots.design.allocation.map((r) => [r.stratum, r.usable_m2]));

const BAD = ['0x10', '1e400', '-1e400', 'NaN', 'Infinity', '=1+1', '＝1', '１２', '12abc', 'abc', '1.2.3', '--5', '5-', '2e', 'e5', '1e13', '-1e13'];

const cellArb = fc.oneof(
  { weight: 5, arbitrary: fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true }).map((v) => ({ text: String(v), value: v as number | null, bad: false })) },
  { weight: 1, arbitrary: fc.constant({ text: '', value: null as number | null, bad: false }) },
  { weight: 2, arbitrary: fc.constantFrom(...BAD).map((text) => ({ text, value: null as number | null, bad: true })) },
);
const rowArb = fc.record({ cell: cellArb, status: fc.constantFrom('', 'done', 'rejected') });

describe('fuzz: results CSV cells through stratplot estimate', () => {
  it('exit 0 with the stratified mean by hand, or one error line with exit 2', async () => {
    const dir = fuzzDir('results');
    const tally = fuzzTally('results');
    await fc.assert(
      fc.asyncProperty(fc.array(rowArb, { minLength: ids.length, maxLength: ids.length }), fc.boolean(), async (rows, withKind) => {
        const lines = ['plot_id,status,value', ...rows.map((r, i) => `${ids[i].id},${r.status},"${r.cell.text.replace(/"/g, '""')}"`)];
        const argv = ['estimate', 'plots.geojson', 'results.csv', '--value', 'value', '--json', ...(withKind ? ['--kind', 'measure'] : [])];
        const r = await fuzzCli(tally, dir, { 'plots.geojson': JSON.stringify(plots), 'results.csv': `${lines.join('\n')}\n` }, argv);
        const measured = rows.map((row, i) => ({ ...row, ...ids[i] })).filter((row) => row.status !== 'rejected');
        const anyBad = measured.some((row) => row.cell.bad);
        if (anyBad) {
          if (r.code === 0) throw new Error(`a non-number on a measured row was accepted: ${JSON.stringify(measured.find((row) => row.cell.bad))}`);
          return;
        }
        const values = measured.filter((row) => row.cell.value !== null);
        if (values.length === 0) return; // nothing to estimate: refused (an empty or all-text column), which is right
        if (r.code !== 0) throw new Error(`plain numbers were refused: ${r.err}`);
        const out = JSON.parse(r.out);
        const total = [...usable.values()].reduce((a, b) => a + b, 0);
        let mean = 0;
        for (const [stratum, area] of usable) {
          const vs = values.filter((v) => v.stratum === stratum).map((v) => v.cell.value as number);
          if (vs.length === 0) {
            mean = Number.NaN;
            break;
          }
          mean += (area / total) * (vs.reduce((a, b) => a + b, 0) / vs.length);
        }
        if (Number.isNaN(mean)) {
          if (out.mean !== null) throw new Error(`a stratum has no values, yet a mean of ${out.mean} was given`);
          return;
        }
        if (!(Math.abs(out.mean - mean) <= 1e-9 * Math.max(1, Math.abs(mean)))) throw new Error(`mean ${out.mean}, by hand ${mean}`);
      }),
      { seed: FUZZ_SEED, numRuns: fuzzRuns(60) },
    );
    fuzzReport(tally);
  });
});
