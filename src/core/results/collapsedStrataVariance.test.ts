import { describe, expect, it } from 'vitest';
import { collapsedStrataVariance } from './collapsedStrataVariance';

describe('collapsedStrataVariance', () => {
  it('is Cochran’s (y_1 − y_2)² for a pair of equal areas (Cochran 1977 §5A.12)', () => {
    // By hand: W = 0.25 each, means 12 and 20 → y = 3 and 5; (3 − 5)² = 4.
    expect(collapsedStrataVariance([{ weight: 0.25, mean: 12 }, { weight: 0.25, mean: 20 }])).toBeCloseTo(4, 12);
  });

  it('follows the Hansen–Hurwitz–Madow form with areas as the size measure for unequal strata', () => {
    // By hand from v_g = L/(L − 1) Σ (y_h − (W_h/W_g) y_g)²: W = 0.3, 0.2; means 20, 26 → y = 6, 5.2,
    // y_g = 11.2, W_g = 0.5; deviations 6 − 0.6·11.2 = −0.72 and 5.2 − 0.4·11.2 = 0.72;
    // 2 · (0.5184 + 0.5184) = 2.0736 (= 4 W_1² W_2² (ȳ_1 − ȳ_2)²/(W_1 + W_2)² = 4·0.09·0.04·36/0.25).
    expect(collapsedStrataVariance([{ weight: 0.3, mean: 20 }, { weight: 0.2, mean: 26 }])).toBeCloseTo(2.0736, 12);
  });

  it('takes L/(L − 1) for a group of three', () => {
    // By hand: W = 0.1 each, means 1, 2, 6 → y = 0.1, 0.2, 0.6, y_g = 0.9, W_h/W_g = 1/3; deviations
    // −0.2, −0.1, 0.3; squares sum 0.14; × 3/2 = 0.21.
    expect(collapsedStrataVariance([{ weight: 0.1, mean: 1 }, { weight: 0.1, mean: 2 }, { weight: 0.1, mean: 6 }])).toBeCloseTo(0.21, 12);
  });

  it('needs two strata', () => {
    expect(() => collapsedStrataVariance([{ weight: 1, mean: 1 }])).toThrow(RangeError);
  });
});
