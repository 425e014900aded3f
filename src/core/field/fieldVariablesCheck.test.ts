import { describe, expect, it } from 'vitest';
import { fieldVariablesCheck } from './fieldVariablesCheck';

describe('fieldVariablesCheck', () => {
  it('trims names and keeps the order', () => {
    expect(fieldVariablesCheck([{ name: ' cover ', kind: 'percent' }, { name: 'stems', kind: 'count' }])).toEqual([
      { name: 'cover', kind: 'percent' },
      { name: 'stems', kind: 'count' },
    ]);
  });

  it('names the variable and what is wrong', () => {
    expect(() => fieldVariablesCheck([{ name: '', kind: 'number' }])).toThrow('field variables, variable 1: give it a name');
    expect(() => fieldVariablesCheck([{ name: 'Cover', kind: 'number' }, { name: 'cover', kind: 'percent' }])).toThrow('variable 2 ("cover"): the same name as variable 1');
    expect(() => fieldVariablesCheck([{ name: 'status', kind: 'text' }])).toThrow(/a column the results table always has/);
    expect(() => fieldVariablesCheck([{ name: 'x', kind: 'colour' as never }])).toThrow(/kind "colour" is not one of number, percent, count, presence, text/);
    expect(() => fieldVariablesCheck(Array.from({ length: 51 }, (_, i) => ({ name: `v${i}`, kind: 'number' as const })))).toThrow(/at most 50/);
  });
});
