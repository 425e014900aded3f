import { describe, expect, it } from 'vitest';
import { fieldValueCheck, fieldVariableResultKind } from './fieldValueCheck';

// The ranges are those of the results checks (resultsValueRead): common practice, no source.
describe('fieldValueCheck', () => {
  it('refuses what the Results step would refuse, in its words', () => {
    expect(fieldValueCheck({ name: 'cover', kind: 'percent' }, '120')).toBe('cover: cover 120 is outside 0–100 %');
    expect(fieldValueCheck({ name: 'stems', kind: 'count' }, '2.5')).toBe('stems: count 2.5 is not a whole number');
    expect(fieldValueCheck({ name: 'stems', kind: 'count' }, '-1')).toBe('stems: count -1 is negative');
    expect(fieldValueCheck({ name: 'height', kind: 'number' }, 'tall')).toBe('height: "tall" is not a number');
    expect(fieldValueCheck({ name: 'orchid', kind: 'presence' }, 'maybe')).toMatch(/not a presence\/absence value/);
  });

  it('accepts blanks, numbers in range and any text for a text variable', () => {
    expect(fieldValueCheck({ name: 'cover', kind: 'percent' }, '')).toBeNull();
    expect(fieldValueCheck({ name: 'cover', kind: 'percent' }, '37.5')).toBeNull();
    expect(fieldValueCheck({ name: 'orchid', kind: 'presence' }, 'present')).toBeNull();
    expect(fieldValueCheck({ name: 'remarks', kind: 'text' }, '=cmd|')).toBeNull();
    expect(fieldValueCheck({ name: 'remarks', kind: 'text' }, 'x'.repeat(2001))).toMatch(/longer than 2000/);
  });

  it('maps each kind to the results kind whose checks it shares', () => {
    expect(['number', 'percent', 'count', 'presence', 'text'].map((k) => fieldVariableResultKind(k as never))).toEqual(['measure', 'cover', 'count', 'presence', null]);
  });
});
