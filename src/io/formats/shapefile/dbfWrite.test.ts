import { describe, expect, it } from 'vitest';
import { dbfRead } from './dbfRead';
import { plotCollectionForField } from '../../../core/field/plotCollectionForField';
import { plotCollectionNamed } from '../../../core/field/plotCollectionNamed';
import { plotsAnnotate } from '../../../core/field/plotsAnnotate';
import { plotsRejectAndPromote } from '../../../core/field/plotsRejectAndPromote';
import { siteLayers } from '../../plots/siteLayers';
import { DBF_SHORT_NAMES, dbfFieldNames, dbfWrite } from './dbfWrite';
import { fieldKitPlots, fieldKitSite } from '../../fixtures/fieldKitSample';

describe('dbfWrite and dbfRead', () => {
  it('keeps field names within the 10-character dBASE limit, unique, with short names for plot fields', () => {
    const names = dbfFieldNames(['nearest_exclusion_m', 'nearest_exclusion_kind', 'very_long_name_one', 'very_long_name_two', 'plot_id', '2nd']);
    expect([...names.values()]).toEqual(['near_ex_m', 'near_ex_kd', 'very_long_', 'very_long2', 'plot_id', 'f2nd']);
    for (const n of names.values()) expect(n.length).toBeLessThanOrEqual(10);
  });

  it('gives every long property of our plot and site layers a deliberate short name, never a blind cut', () => {
    const site = fieldKitSite();
    const plots = fieldKitPlots(site);
    const first = plots.features[0].properties.plot_id;
    const rejected = plotsRejectAndPromote(plots, first, 'Under water', '2026-12-01T09:00:00Z').collection;
    const field = plotCollectionForField(plotsAnnotate(plotCollectionNamed(rejected, site.strata), site, { surveyDate: new Date('2026-12-01T00:00:00Z') }));
    const keys = new Set(siteLayers(field, site).flatMap((l) => l.features.features.flatMap((f) => Object.keys(f.properties ?? {}))));
    const long = [...keys].filter((k) => k.length > 10);
    expect(long.length).toBeGreaterThan(5);
    for (const k of long) expect(DBF_SHORT_NAMES[k], k).toBeDefined();
    const names = dbfFieldNames([...keys]);
    expect([...names.values()]).not.toContain('access_poi');
    expect([...names.values()]).not.toContain('declinatio');
    expect(names.get('access_point')).toBe('access_pt');
    expect(names.get('declination_deg')).toBe('decl_deg');
  });

  it('writes the dBASE III header layout: version 3, record count, header and record lengths', () => {
    // dBASE III PLUS structure: byte 0 version, 4–7 records (LE), 8–9 header bytes, 10–11 record bytes, 0x0D after the fields.
    const bytes = dbfWrite([{ a: 1 }, { a: 22 }], ['a'], new Date('2026-02-03T00:00:00Z'));
    const v = new DataView(bytes.buffer);
    expect([bytes[0], bytes[1], bytes[2], bytes[3]]).toEqual([3, 126, 2, 3]);
    expect(v.getUint32(4, true)).toBe(2);
    expect(v.getUint16(8, true)).toBe(65);
    expect(v.getUint16(10, true)).toBe(3);
    expect(bytes[64]).toBe(0x0d);
    expect(bytes[bytes.length - 1]).toBe(0x1a);
  });

  it('round-trips numbers exactly, booleans, nulls and UTF-8 text', () => {
    const rows = [
      { n: -122.41816999999999, i: 3, b: true, t: 'Ngā otaota', z: null },
      { n: 0.1, i: -40, b: false, t: '草地', z: null },
      { n: null, i: 7, b: null, t: null, z: null },
    ];
    const back = dbfRead(dbfWrite(rows, ['n', 'i', 'b', 't', 'z']), 'x.dbf', 'utf-8').rows;
    expect(back).toEqual(rows);
  });

  it('cuts text over 254 bytes at a character boundary', () => {
    const long = 'é'.repeat(200);
    const back = dbfRead(dbfWrite([{ t: long }], ['t']), 'x.dbf', 'utf-8').rows[0]!.t as string;
    expect(back).toBe('é'.repeat(127));
  });

  it('says which file is too short', () => {
    expect(() => dbfRead(new Uint8Array(10), 'x.dbf')).toThrow('x.dbf: the .dbf file is too short to be a dBASE table');
  });
});
