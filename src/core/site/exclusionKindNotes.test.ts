import { describe, expect, it } from 'vitest';
import { EXCLUSION_KIND_NOTES, exclusionKindNote } from './exclusionKindNotes';
import { EXCLUSION_KINDS } from '../model/types';

describe('exclusionKindNote', () => {
  it('has a note for every exclusion kind', () => {
    for (const k of EXCLUSION_KINDS) expect(EXCLUSION_KIND_NOTES[k].length).toBeGreaterThan(20);
  });

  it('requires landholder permission for private land (common practice, no source)', () => {
    expect(exclusionKindNote({ kind: 'private' })).toMatch(/landholder permission required before entry/i);
  });

  it('adds the mapped name and notes of the exclusion', () => {
    // Invented example name.
    const note = exclusionKindNote({ kind: 'private', name: 'Ridge paddock', notes: 'call the owner a day ahead' });
    expect(note).toMatch(/\(Ridge paddock: call the owner a day ahead\)$/);
  });
});
