import { describe, expect, it } from 'vitest';
import { footprintReshape } from './FootprintField';

describe('changing the footprint shape', () => {
  // Same ground area by hand: a 20 m square is 400 m²; a circle of 400 m² has r = √(400/π) = 11.28 m.
  it('keeps the plot area when a square becomes a circle and back', () => {
    expect(footprintReshape({ shape: 'square', sideM: 20, angleDeg: 30 }, 'circle')).toEqual({ shape: 'circle', radiusM: 11.28 });
    expect(footprintReshape({ shape: 'circle', radiusM: 11.28 }, 'square')).toEqual({ shape: 'square', sideM: 19.99, angleDeg: 0 });
  });

  it('turns a square into a rectangle of the same sides and angle, and a point into a 20 m square', () => {
    expect(footprintReshape({ shape: 'square', sideM: 10, angleDeg: 45 }, 'rect')).toEqual({ shape: 'rect', widthM: 10, heightM: 10, angleDeg: 45 });
    expect(footprintReshape({ shape: 'point' }, 'square')).toEqual({ shape: 'square', sideM: 20, angleDeg: 0 });
  });
});
