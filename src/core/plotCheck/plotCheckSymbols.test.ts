import { describe, expect, it } from 'vitest';
import { EXCLUSION_COLOURS } from '../site/exclusionColours';
import { PLOT_CHECK_SYMBOLS, plotCheckSymbolCover } from './plotCheckSymbols';
import { PLOT_SYMBOLS, plotSymbolCover } from '../field/plotSymbols';

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

describe('the checked-plot symbols', () => {
  it('keep the warning yellow well clear of the hazard colour, every exclusion colour and the plot symbol colours', () => {
    // 40 is the margin the plot symbol code keeps (see plotSymbols.test.ts; common practice, no source).
    const warn = PLOT_CHECK_SYMBOLS.fail.fill;
    expect(deltaE(warn, EXCLUSION_COLOURS.hazard)).toBeGreaterThan(40);
    for (const c of Object.values(EXCLUSION_COLOURS)) expect(deltaE(warn, c), c).toBeGreaterThan(40);
    for (const s of Object.values(PLOT_SYMBOLS)) for (const c of [s.fill, s.ink]) expect(deltaE(warn, c), c).toBeGreaterThan(40);
    // Dark ink on the yellow: WCAG 2.1 contrast well above 7:1 comes with an L* difference this large.
    expect(lab(warn)[0] - lab(PLOT_CHECK_SYMBOLS.fail.ink)[0]).toBeGreaterThan(70);
  });

  it('differ from every plot symbol: in outline from the diamonds, and by a mark no plot symbol has', () => {
    // Outlines compared on a 81 × 81 grid over the symbol box: points covered by one and not the other.
    const grid = Array.from({ length: 81 }, (_, i) => -1 + i / 40);
    const mask = (cover: (x: number, y: number) => unknown) => grid.flatMap((y) => grid.map((x) => cover(x, y) !== null));
    const hexagon = mask((x, y) => plotCheckSymbolCover(PLOT_CHECK_SYMBOLS.fail, x, y));
    for (const sym of [PLOT_SYMBOLS.reserve, PLOT_SYMBOLS.promoted]) {
      const other = mask((x, y) => plotSymbolCover(sym, x, y));
      const differ = hexagon.filter((h, i) => h !== other[i]).length;
      const union = hexagon.filter((h, i) => h || other[i]).length;
      expect(differ / union, sym.key).toBeGreaterThan(0.1);
    }
    // The bar of the exclamation mark (0, -0.3) and the tick's corner (-0.1, 0.27): no plot symbol inks either.
    for (const s of Object.values(PLOT_SYMBOLS)) {
      expect(plotSymbolCover(s, 0, -0.3), s.key).not.toBe('ink');
      expect(plotSymbolCover(s, -0.1, 0.27), s.key).not.toBe('ink');
    }
    expect(plotCheckSymbolCover(PLOT_CHECK_SYMBOLS.pass, -0.1, 0.27)).toBe('ink');
  });

  it('marks a failing plot with an exclamation mark and a passing one with a tick in an open hexagon', () => {
    const fail = PLOT_CHECK_SYMBOLS.fail;
    const pass = PLOT_CHECK_SYMBOLS.pass;
    expect(plotCheckSymbolCover(fail, 0, -0.3)).toBe('ink');
    expect(plotCheckSymbolCover(fail, 0, 0.33)).toBe('ink');
    expect(plotCheckSymbolCover(fail, 0.35, 0)).toBe('fill');
    expect(plotCheckSymbolCover(pass, 0, -0.3)).toBe('white');
    expect(plotCheckSymbolCover(pass, 0.36, -0.24)).toBe('ink');
    expect(plotCheckSymbolCover(pass, 1.2, 0)).toBeNull();
  });
});
