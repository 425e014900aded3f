import { describe, expect, it } from 'vitest';
import { polygonAreaM2 } from '../geo/polygonAreaM2';
import { repairDropDuplicateVertices } from './repairDropDuplicateVertices';
import { siteValidate } from './siteValidate';
import type { StratumPart } from '../model/types';

const ring = [[150.5, -35.1], [150.502, -35.1], [150.502, -35.1], [150.502, -35.098], [150.5, -35.098], [150.5, -35.098], [150.5, -35.1]];
const part: StratumPart = { id: 'a', stratum: 'A', geometry: { type: 'Polygon', coordinates: [ring] } };

describe('repairDropDuplicateVertices', () => {
  it('drops repeated vertices, keeps the closing one and the area', () => {
    const { parts, verticesDropped } = repairDropDuplicateVertices([part]);
    expect(verticesDropped).toBe(2);
    expect((parts[0].geometry.coordinates as number[][][])[0]).toEqual([[150.5, -35.1], [150.502, -35.1], [150.502, -35.098], [150.5, -35.098], [150.5, -35.1]]);
    expect(polygonAreaM2(parts[0].geometry)).toBeCloseTo(polygonAreaM2(part.geometry), 6);
  });

  it('keeps one closing vertex when the last vertices repeat the first', () => {
    const r = [[0, 0], [1, 0], [1, 1], [0, 0], [0, 0]];
    const { parts } = repairDropDuplicateVertices([{ id: 'b', stratum: 'A', geometry: { type: 'Polygon', coordinates: [r] } }]);
    expect((parts[0].geometry.coordinates as number[][][])[0]).toEqual([[0, 0], [1, 0], [1, 1], [0, 0]]);
  });

  it('clears the duplicate-vertex warning', () => {
    const site = { name: 'Invented test site', strata: [], exclusions: [], access: [], boundary: null };
    expect(siteValidate({ ...site, parts: [part] }).map((p) => p.code)).toEqual(['ring-duplicate-vertices']);
    expect(siteValidate({ ...site, parts: repairDropDuplicateVertices([part]).parts })).toEqual([]);
  });
});
