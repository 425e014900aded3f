import { describe, expect, it } from 'vitest';
import { repairCloseRings } from './repairCloseRings';
import { siteValidate } from './siteValidate';
import type { Site, StratumPart } from '../model/types';

const open: StratumPart = { id: 'a', stratum: 'A', geometry: { type: 'Polygon', coordinates: [[[150.5, -35.1], [150.502, -35.1], [150.502, -35.098], [150.5, -35.098]]] } };
const closed: StratumPart = { id: 'b', stratum: 'B', geometry: { type: 'Polygon', coordinates: [[[150.6, -35.1], [150.602, -35.1], [150.6, -35.098], [150.6, -35.1]]] } };
const site = (parts: StratumPart[]): Site => ({ name: 'Invented test site', strata: [], parts, exclusions: [], access: [], boundary: null });

describe('repairCloseRings', () => {
  it('closes an open ring and leaves closed ones as they are', () => {
    const { parts, ringsClosed } = repairCloseRings([open, closed]);
    expect(ringsClosed).toBe(1);
    expect(parts[1]).toBe(closed);
    const ring = (parts[0].geometry.coordinates as number[][][])[0];
    expect(ring).toHaveLength(5);
    expect(ring[4]).toEqual(ring[0]);
  });

  it('leaves the input untouched and clears the validation error', () => {
    expect(siteValidate(site([open])).map((p) => p.code)).toEqual(['ring-not-closed']);
    const { parts } = repairCloseRings([open]);
    expect((open.geometry.coordinates as number[][][])[0]).toHaveLength(4);
    expect(siteValidate(site(parts))).toEqual([]);
  });
});
