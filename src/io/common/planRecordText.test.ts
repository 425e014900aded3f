import { describe, expect, it } from 'vitest';
import { planRecordDelta, planRecordFromDelta, planRecordText } from './planRecordText';

// Invented plans, written as JSON.stringify writes them (RFC 8259).
const plan = { format: 'stratplot-plan', version: 7, savedAt: '', site: { name: 'Kōwhai gully (invented) "north"' }, design: { plots: 12 } };

describe('planRecordText', () => {
  it('puts the save time into the plan text and wraps it with whether it was saved, as JSON.stringify would write the record', () => {
    const savedAt = '2026-12-04T20:15:00.000Z';
    const whole = JSON.stringify(plan);
    // Cut anywhere, even inside the head: the pieces are joined as they come.
    for (const cut of [[], [10], [30, 60]]) {
      const pieces = [0, ...cut].map((a, i, all) => whole.slice(a, all[i + 1] ?? whole.length));
      expect(planRecordText({ hashTextPieces: pieces, savedAt, saved: true })).toBe(JSON.stringify({ plan: { ...plan, savedAt }, saved: true }));
    }
    const text = planRecordText({ hashTextPieces: [whole], savedAt, saved: true });
    expect(text).toBe(JSON.stringify({ plan: { ...plan, savedAt }, saved: true }));
  });

  it('gives the same value for a plan text whose keys come in another order', () => {
    const other = { site: plan.site, format: plan.format, savedAt: '', version: 7 };
    const text = planRecordText({ hashTextPieces: [JSON.stringify(other)], savedAt: '2026-12-04T20:16:00.000Z', saved: false });
    expect(JSON.parse(text)).toEqual({ plan: { ...other, savedAt: '2026-12-04T20:16:00.000Z' }, saved: false });
  });
});

describe('planRecordDelta', () => {
  const big = (c: string) => c.repeat(5000);
  it('sends again only the long pieces the receiver does not hold, and the receiver gets the same record back', () => {
    const previous = ['{"format":"stratplot-plan","version":7,"savedAt":"","site":', big('a'), ',', big('b'), '}'];
    const record = { hashTextPieces: [previous[0], big('b'), ',', big('c'), ',', big('a'), '}'], savedAt: '2026-12-04T21:00:00.000Z', saved: false };
    const delta = planRecordDelta(record, previous);
    expect(delta.pieces.map((p) => (typeof p === 'number' ? p : p.length))).toEqual([previous[0].length, 3, 1, 5000, 1, 1, 1]);
    expect(planRecordFromDelta(delta, previous)).toEqual(record);
    expect(planRecordFromDelta(planRecordDelta(record, []), [])).toEqual(record);
  });

  it('refuses a delta that names a piece the receiver does not hold', () => {
    expect(() => planRecordFromDelta({ pieces: [4], savedAt: '', saved: false }, ['x'])).toThrow('piece 4');
  });
});
