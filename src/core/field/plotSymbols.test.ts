import { describe, expect, it } from 'vitest';
import { EXCLUSION_COLOURS } from '../site/exclusionColours';
import { PLOT_FIELD_STATE_KEYS } from './plotFieldState';
import { PLOT_SYMBOLS, plotSymbolCover } from './plotSymbols';

/** CIELAB (D65) of an sRGB #rrggbb: IEC 61966-2-1 transfer curve and matrix, CIE 15:2004 L*a*b*. */
function lab(hex: string): [number, number, number] {
  const lin = (c: number) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4);
  const [r, g, b] = [1, 3, 5].map((i) => lin(Number.parseInt(hex.slice(i, i + 2), 16) / 255));
  const x = (0.4124 * r + 0.3576 * g + 0.1805 * b) / 0.95047;
  const y = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  const z = (0.0193 * r + 0.1192 * g + 0.9505 * b) / 1.08883;
  const f = (t: number) => (t > (6 / 29) ** 3 ? Math.cbrt(t) : t / (3 * (6 / 29) ** 2) + 4 / 29);
  return [116 * f(y) - 16, 500 * (f(x) - f(y)), 200 * (f(y) - f(z))];
}

/** CIE 1976 colour difference ΔE*ab (CIE 15:2004 §8.2.1). */
function deltaE(a: string, b: string): number {
  const [p, q] = [lab(a), lab(b)];
  return Math.hypot(p[0] - q[0], p[1] - q[1], p[2] - q[2]);
}

// The results ramp the planner colours measured plots with (viridis, ten stops; see resultsPlotColours).
const VIRIDIS = ['#440154', '#482878', '#3e4a89', '#31688e', '#26828e', '#1f9e89', '#35b779', '#6dcd59', '#b4de2c', '#fde725'];

describe('the plot symbol code', () => {
  it('keeps the promoted-reserve colour well clear of the hazard colour and of every stop of the results ramp', () => {
    // ΔE*ab ≈ 2.3 is a just-noticeable difference (Sharma 2003, Digital Color Imaging Handbook; from
    // memory); 40 is our own margin for small symbols seen on imagery (common practice, no source).
    const promoted = PLOT_SYMBOLS.promoted.fill;
    expect(deltaE(promoted, EXCLUSION_COLOURS.hazard)).toBeGreaterThan(40);
    for (const stop of VIRIDIS) expect(deltaE(promoted, stop), stop).toBeGreaterThan(40);
    for (const c of Object.values(EXCLUSION_COLOURS)) expect(deltaE(promoted, c), c).toBeGreaterThan(40);
  });

  it('tells the four states apart by shape and fill, not colour alone', () => {
    const forms = PLOT_FIELD_STATE_KEYS.map((k) => {
      const s = PLOT_SYMBOLS[k];
      return `${s.shape}/${s.solid}/${s.centreDot}/${s.struck}`;
    });
    expect(new Set(forms).size).toBe(4);
    // Active plots are solid, the others open.
    expect(PLOT_FIELD_STATE_KEYS.filter((k) => PLOT_SYMBOLS[k].solid)).toEqual(['primary', 'promoted']);
  });

  it('draws a cross through a rejected plot and a white centre in an active one', () => {
    expect(plotSymbolCover(PLOT_SYMBOLS.rejected, 0.3, 0.3)).toBe('ink');
    expect(plotSymbolCover(PLOT_SYMBOLS.rejected, 0.3, 0)).toBe('white');
    expect(plotSymbolCover(PLOT_SYMBOLS.primary, 0, 0)).toBe('white');
    expect(plotSymbolCover(PLOT_SYMBOLS.primary, 0.5, 0)).toBe('fill');
    expect(plotSymbolCover(PLOT_SYMBOLS.reserve, 0, 0)).toBe('white');
    expect(plotSymbolCover(PLOT_SYMBOLS.reserve, 0.95, 0)).toBe('white');
    expect(plotSymbolCover(PLOT_SYMBOLS.reserve, 1.2, 0)).toBeNull();
  });
});
