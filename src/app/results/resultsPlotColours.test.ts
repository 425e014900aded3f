import { describe, expect, it } from 'vitest';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { resultsPlotColours, resultsRampColour, VIRIDIS_STOPS } from './resultsPlotColours';

// Invented plot file (not a real site).
const plots = plotCollectionInvented([{ key: 'Coastal heath', code: 'HEA', primaries: 4, reserves: 1, mappedM2: 50_000, usableM2: 50_000 }]);

/** WCAG 2.2 relative luminance of #rrggbb (W3C, "relative luminance" definition). */
function luminance(hex: string): number {
  const c = [1, 3, 5].map((i) => Number.parseInt(hex.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  return 0.2126 * c[0] + 0.7152 * c[1] + 0.0722 * c[2];
}

describe('resultsPlotColours', () => {
  it('paints the lowest value with viridis’ first stop and the highest with its last', () => {
    const values = { 'HEA-01': { cover: 10 }, 'HEA-02': { cover: 55 }, 'HEA-03': { cover: 100 } };
    const c = resultsPlotColours(plots, values, 'cover');
    // viridisLite viridis(10): first "#440154", last "#FDE725"; 55 is the ramp's middle, between stops 5 and 6.
    expect(c['HEA-01']).toBe('#440154');
    expect(c['HEA-03']).toBe('#fde725');
    expect(c['HEA-02']).toBe(resultsRampColour(0.5));
    // By hand: halfway between stops 5 (#26828e) and 6 (#1f9e89). matplotlib's own viridis(0.5) is
    // #21918c (from memory): the ten-stop ramp stays within 2 levels per channel of it.
    expect(resultsRampColour(0.5)).toBe('#23908c');
  });

  it('leaves plots without a value out, so the map keeps their usual symbol', () => {
    const c = resultsPlotColours(plots, { 'HEA-02': { cover: 5 }, 'HEA-04': { stems: 3 } }, 'cover');
    expect(Object.keys(c)).toEqual(['HEA-02']);
    expect(resultsPlotColours(plots, {}, 'cover')).toEqual({});
  });

  it('gives every plot the middle colour when all values are equal', () => {
    const c = resultsPlotColours(plots, { 'HEA-01': { cover: 7 }, 'HEA-02': { cover: 7 } }, 'cover');
    expect(new Set(Object.values(c))).toEqual(new Set([resultsRampColour(0.5)]));
  });

  it('gets lighter at every stop, so the ramp also reads in grey-scale', () => {
    const lum = VIRIDIS_STOPS.map(luminance);
    for (let i = 1; i < lum.length; i++) expect(lum[i]).toBeGreaterThan(lum[i - 1]);
  });
});
