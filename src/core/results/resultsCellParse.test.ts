import { describe, expect, it } from 'vitest';
import { resultsCellNumber, resultsCellPresence, resultsKindGuess } from './resultsCellParse';

describe('resultsCellNumber', () => {
  it('reads decimal points and decimal commas by the file mark', () => {
    expect(resultsCellNumber('12.5', '.')).toBe(12.5);
    expect(resultsCellNumber(' 12,5 ', ',')).toBe(12.5);
    expect(resultsCellNumber('-3', ',')).toBe(-3);
    expect(resultsCellNumber('40 %', '.')).toBe(40);
    expect(resultsCellNumber('1e3', '.')).toBe(1000);
  });

  it('calls a blank cell missing and anything else not a number', () => {
    expect(resultsCellNumber('  ', '.')).toBeNull();
    expect(resultsCellNumber('12,5', '.')).toBeNaN();
    expect(resultsCellNumber('1.234,5', ',')).toBeNaN();
    expect(resultsCellNumber('abc', '.')).toBeNaN();
  });
});

describe('resultsCellPresence', () => {
  it.each([
    ['Yes', 1],
    ['PRESENT', 1],
    ['y', 1],
    ['True', 1],
    ['1', 1],
    ['no', 0],
    ['Absent', 0],
    ['N', 0],
    ['false', 0],
    ['0', 0],
  ])('reads %s as %d', (text, value) => {
    expect(resultsCellPresence(text)).toBe(value);
  });

  it('rejects other words', () => {
    expect(resultsCellPresence('maybe')).toBeNaN();
  });
});

describe('resultsKindGuess', () => {
  it('guesses presence, cover, count and measure', () => {
    expect(resultsKindGuess('orchid', ['yes', 'no', ''])).toBe('presence');
    expect(resultsKindGuess('shrub_cover', ['10', '20'])).toBe('cover');
    expect(resultsKindGuess('stem_count', ['3', '0'])).toBe('count');
    expect(resultsKindGuess('height_cm', ['3.2'])).toBe('measure');
    expect(resultsKindGuess('flag', ['0', '1'])).toBe('measure');
  });
});
