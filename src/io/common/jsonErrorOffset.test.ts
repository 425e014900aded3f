import { describe, expect, it } from 'vitest';
import { jsonErrorOffset } from './jsonErrorOffset';

describe('jsonErrorOffset', () => {
  it('returns -1 for valid JSON of every kind', () => {
    for (const t of ['{}', '[]', ' {"a": [1, -2.5e3, true, false, null, "x\\u00e9\\n"]} ', '"s"', '0']) expect(jsonErrorOffset(t)).toBe(-1);
  });

  it('points at the first offending character', () => {
    expect(jsonErrorOffset('{"a": [,]}')).toBe(7);
    expect(jsonErrorOffset('{"a": tru}')).toBe(9);
    expect(jsonErrorOffset('[1 2]')).toBe(3);
    expect(jsonErrorOffset('{a: 1}')).toBe(1);
    expect(jsonErrorOffset('{"a": 1')).toBe(7);
    expect(jsonErrorOffset('')).toBe(0);
    expect(jsonErrorOffset('{} x')).toBe(3);
    expect(jsonErrorOffset('{"a": 01}')).toBe(7);
  });

  it('agrees with JSON.parse on which texts are valid', () => {
    // JSON.parse (ECMA-404 / RFC 8259 grammar) is the outside reference.
    for (const t of ['{"a":1,}', '[1,]', '{"a" 1}', '"\\x"', '-', '1.', '.5', '{"a":[{"b":[]}]}', '  [  ]  ', 'nul']) {
      let valid = true;
      try {
        JSON.parse(t);
      } catch {
        valid = false;
      }
      expect(jsonErrorOffset(t) === -1).toBe(valid);
    }
  });
});
