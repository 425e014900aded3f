import { describe, expect, it } from 'vitest';
import { footprintAreaM2, footprintFormat, footprintParse } from './footprintParse';

describe('footprintParse', () => {
  it('reads point, square, rotated rectangle and circle footprints', () => {
    expect(footprintParse('point')).toEqual({ shape: 'point' });
    expect(footprintParse('square:10')).toEqual({ shape: 'square', sideM: 10, angleDeg: 0 });
    expect(footprintParse('rect:20x5@30')).toEqual({ shape: 'rect', widthM: 20, heightM: 5, angleDeg: 30 });
    expect(footprintParse('circle:5.64')).toEqual({ shape: 'circle', radiusM: 5.64 });
  });

  it('writes a footprint back the way it reads it', () => {
    for (const t of ['point', 'square:10', 'rect:20x5@30', 'circle:5']) expect(footprintFormat(footprintParse(t))).toBe(t);
  });

  it('gives plot areas in m² (a 5.64 m radius circle is the usual 0.01 ha plot, from memory)', () => {
    expect(footprintAreaM2(footprintParse('rect:20x5'))).toBe(100);
    expect(footprintAreaM2(footprintParse('circle:5.64'))).toBeCloseTo(99.93, 2);
  });

  it('names the option and the accepted forms when the text is wrong', () => {
    expect(() => footprintParse('hexagon:4', '--footprint')).toThrow(/--footprint "hexagon:4" is not understood; write point, square/);
    expect(() => footprintParse('square:0', '--footprint')).toThrow(/side must be more than 0 m/);
  });
});
