// @vitest-environment happy-dom
import { act } from 'react';
import { createRoot, type Root } from 'react-dom/client';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import type { DesignSettings } from '../../core/model/designTypes';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { plannerPlotsNamed } from '../../state/plotsNamed';
import { recaptureGridSet, resultsClear, resultsLoad, resultsOptionsSet } from '../../state/resultsStore';
import { ResultsPanel } from './ResultsPanel';
import { resultsStore } from './resultsStoreInstance';

(globalThis as { IS_REACT_ACT_ENVIRONMENT?: boolean }).IS_REACT_ACT_ENVIRONMENT = true;

// Invented plot file (not a real site): heath 5 ha, saltmarsh 3 ha usable; 10 m square plots.
const plots = plotCollectionInvented([
  { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 1, mappedM2: 60_000, usableM2: 50_000 },
  { key: 'Saltmarsh', code: 'SAL', primaries: 3, reserves: 1, mappedM2: 40_000, usableM2: 30_000 },
]);
const CSV = 'plot_id;stems;cover;orchid\nHEA-01;3;10,5;yes\nHEA-02;5;20;no\nHEA-03;4;15;no\nHEA-04;8;30;yes\nSAL-01;1;5;no\nSAL-02;0;0;no\nSAL-03;2;10;yes\n';

let root: Root;
let holder: HTMLDivElement;
let patches: Partial<DesignSettings>[];

function render() {
  act(() => root.render(<ResultsPanel collection={plots} onUseInDesign={(p) => patches.push(p)} />));
}

beforeEach(() => {
  holder = document.createElement('div');
  document.body.append(holder);
  root = createRoot(holder);
  patches = [];
  resultsClear(resultsStore);
  resultsStore.setState({ collapse: false, perHa: false, colourOn: false, target: { value: 0.1, relative: true } });
});

afterEach(() => {
  act(() => root.unmount());
  holder.remove();
});

describe('ResultsPanel', () => {
  it('shows the stratified mean worked by hand and the charts with their names', () => {
    render();
    act(() => resultsLoad(resultsStore, 'field.csv', CSV, plots));
    // By hand (Cochran 1977 ch. 5): W = 5/8, 3/8; stems means 5 and 1 → 0.625·5 + 0.375·1 = 3.5.
    expect(holder.querySelector('td[data-cell="mean"]')?.textContent).toBe('3.50');
    expect(holder.querySelectorAll('table[aria-label="Estimate of stems by stratum"] tbody tr')).toHaveLength(2);
    const names = [...holder.querySelectorAll('svg[role="img"] title')].map((t) => t.textContent);
    expect(names).toEqual(['Mean stems by stratum with 95 % intervals', 'Share of plots against share of area, by stratum']);
    expect(holder.textContent).toContain('Estimates cover the usable area of the strata (8.00 ha)');
    expect(holder.textContent).toContain('No problems found in the results file.');
  });

  it('hands the Neyman size and the observed SDs to the design when asked', () => {
    render();
    act(() => resultsLoad(resultsStore, 'field.csv', CSV, plots));
    act(() => resultsOptionsSet(resultsStore, { target: { value: 1, relative: false } }, plots));
    const button = [...holder.querySelectorAll('button')].find((b) => b.getAttribute('aria-label')?.endsWith('neyman allocation, in the design'));
    act(() => button?.dispatchEvent(new MouseEvent('click', { bubbles: true })));
    const s = resultsStore.getState();
    // Observed SDs by hand: heath s² = 14/3, saltmarsh s² = 1.
    expect(patches).toEqual([{ plots: s.next?.neyman.n, allocation: 'neyman', sd: { 'Coastal heath': Math.sqrt(14 / 3), Saltmarsh: 1 }, targetHalfwidth: null }]);
  });

  it('lists errors with their row and column and gives no estimate', () => {
    render();
    act(() => resultsLoad(resultsStore, 'field.csv', CSV.replace('HEA-03;4;', 'HEA-03;four;'), plots));
    const rows = [...holder.querySelectorAll('table[aria-label="Problems in the results file"] tbody tr')].map((tr) => [...tr.querySelectorAll('td')].map((td) => td.textContent));
    expect(rows).toEqual([
      ['✕ error', '4', 'stems', 'field.csv row 4, column stems: "four" is not a number (this file uses decimal commas)'],
      ['! warning', '4', 'stems', 'field.csv row 4, column stems: primary HEA-03 has no result and no replacement (stratum "Coastal heath" is short by one plot)'],
    ]);
    expect(holder.querySelector('table[aria-label="Estimate of stems by stratum"]')).toBeNull();
    expect(holder.textContent).toContain('No estimate until the 1 error listed under Problems is fixed');
  });

  it('names a renamed stratum by its current name in the table, the chart and the problems, and cites without guessed sections', () => {
    // The Results step is given the plots named as the planner shows them (plannerPlotsNamed).
    const drawn = plotCollectionInvented([
      { key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 1, mappedM2: 60_000, usableM2: 50_000 },
      { key: 'Stratum 7', code: 'FAR', primaries: 3, reserves: 1, mappedM2: 40_000, usableM2: 30_000 },
    ]);
    const strata = [
      { key: 'Coastal heath', label: 'Coastal heath', code: 'HEA', colour: '#cc6677' },
      { key: 'Stratum 7', label: 'Farm paddock', code: 'FAR', colour: '#332288' },
    ];
    const named = plannerPlotsNamed({ result: drawn, site: { name: 'x', strata, parts: [], exclusions: [], access: [], boundary: null } })!;
    act(() => root.render(<ResultsPanel collection={named} onUseInDesign={(p) => patches.push(p)} />));
    act(() => resultsLoad(resultsStore, 'field.csv', CSV.replace(/SAL-/g, 'FAR-').replace('FAR-03;2;10;yes\n', ''), named));
    expect(holder.textContent).toContain('Farm paddock');
    expect(holder.textContent).not.toContain('Stratum 7');
    expect(holder.textContent).toContain('primary FAR-03 has no row and no replacement (stratum "Farm paddock" is short by one plot)');
    expect(holder.textContent).not.toMatch(/from memory|§/);
  });

  it('works out a recapture grid as it is typed', () => {
    render();
    act(() => recaptureGridSet(resultsStore, 'grid-1', { marked: '948', caught: '421', recaptured: '167' }));
    // Krebs 1989 Box 2.1 (docs/references.md §4): Chapman 2382.80.
    expect(holder.querySelector('dd[data-fact="chapman"]')?.textContent).toBe('2,383');
  });
});
