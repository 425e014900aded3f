import { describe, expect, it } from 'vitest';
import { isInputError } from '../common/InputError';
import { graticuleLines, graticuleStepDeg } from './graticule';

describe('graticuleLines', () => {
  it('draws meridians and parallels on whole multiples of the step inside the box', () => {
    const fc = graticuleLines([146.9, -42.4, 147.6, -41.9], 0.25);
    const meridians = fc.features.filter((f) => f.properties.kind === 'meridian').map((f) => f.properties.valueDeg);
    const parallels = fc.features.filter((f) => f.properties.kind === 'parallel').map((f) => f.properties.valueDeg);
    expect(meridians).toEqual([147, 147.25, 147.5]);
    expect(parallels).toEqual([-42.25, -42]);
    for (const f of fc.features) {
      for (const [lon, lat] of f.geometry.coordinates) {
        expect(lon).toBeGreaterThanOrEqual(146.9);
        expect(lon).toBeLessThanOrEqual(147.6);
        expect(lat).toBeGreaterThanOrEqual(-42.4);
        expect(lat).toBeLessThanOrEqual(-41.9);
      }
    }
  });

  it('labels lines in degrees and minutes as GeographicLib GeoConvert writes them', () => {
    // `echo "-42.5 147.5" | GeoConvert -d` → 42d30'00.0"S 147d30'00.0"E (GeographicLib 2.1.2);
    // `echo "-42.1666666666667 147.0833333333333" | GeoConvert -d` → 42d10'00.0"S 147d05'00.0"E.
    const labels = graticuleLines([147.0, -42.6, 147.6, -42.0], 5 / 60).features.map((f) => f.properties.label);
    expect(labels).toContain('147°30′E');
    expect(labels).toContain('147°05′E');
    expect(labels).toContain('42°30′S');
    expect(labels).toContain('42°10′S');
  });

  it('adds seconds when the step is finer than a minute', () => {
    // `echo "12.0041666666667 -0.0083333333333" | GeoConvert -d` → 12d00'15.0"N 000d00'30.0"W.
    const labels = graticuleLines([-0.01, 12.0, 0.0, 12.005], 15 / 3600).features.map((f) => f.properties.label);
    expect(labels).toContain('12°00′15″N');
    expect(labels).toContain('0°00′30″W');
  });

  it('keeps whole degrees short and leaves the equator and prime meridian without a letter', () => {
    const labels = graticuleLines([-10, -10, 10, 10], 10).features.map((f) => f.properties.label);
    expect(labels).toEqual(['10°W', '0°', '10°E', '10°S', '0°', '10°N']);
  });

  it('crosses the antimeridian when east is less than west', () => {
    const fc = graticuleLines([175, -20, -175, -10], 5);
    const meridians = fc.features.filter((f) => f.properties.kind === 'meridian');
    expect(meridians.map((f) => f.properties.valueDeg)).toEqual([175, 180, -175]);
    expect(meridians.map((f) => f.properties.label)).toEqual(['175°E', '180°', '175°W']);
    // Coordinates run on past 180 so the line is continuous; maplibre draws that across the seam.
    expect(meridians[2].geometry.coordinates[0][0]).toBe(185);
  });

  it('stops short of the poles and densifies long lines to 1° edges', () => {
    const fc = graticuleLines([-180, -90, 180, 90], 30);
    for (const f of fc.features) {
      const c = f.geometry.coordinates;
      for (const [, lat] of c) expect(Math.abs(lat)).toBeLessThanOrEqual(85);
      for (let k = 1; k < c.length; k++) {
        expect(Math.max(Math.abs(c[k][0] - c[k - 1][0]), Math.abs(c[k][1] - c[k - 1][1]))).toBeLessThanOrEqual(1);
      }
    }
    expect(fc.features.filter((f) => f.properties.kind === 'parallel').map((f) => f.properties.valueDeg)).toEqual([
      -60, -30, 0, 30, 60,
    ]);
  });

  it('refuses a step that would need thousands of lines, saying so', () => {
    try {
      graticuleLines([-180, -85, 180, 85], 1 / 3600);
      expect.unreachable();
    } catch (e) {
      expect(isInputError(e)).toBe(true);
      expect((e as Error).message).toMatch(/use a larger step/);
    }
  });

  it('refuses a box with south above north and a step of zero', () => {
    expect(() => graticuleLines([0, 10, 1, 5], 1)).toThrow(/south 10° is north of its north 5°/);
    expect(() => graticuleLines([0, 0, 1, 1], 0)).toThrow(/step 0° must be a positive number/);
  });
});

describe('graticuleStepDeg', () => {
  it('picks the largest readable step giving at least four lines', () => {
    expect(graticuleStepDeg(360)).toBe(30);
    expect(graticuleStepDeg(12)).toBe(2);
    expect(graticuleStepDeg(1)).toBeCloseTo(10 / 60, 12);
    expect(graticuleStepDeg(0.05)).toBeCloseTo(30 / 3600, 12);
  });
});
