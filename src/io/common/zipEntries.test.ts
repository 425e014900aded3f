import { zipSync } from 'fflate';
import { describe, expect, it } from 'vitest';
import { zipWithDeclaredSize } from '../../../tests/hostile/hostileFiles';
import { zipEntries, zipEntryPaths } from './zipEntries';

const text = (s: string) => new TextEncoder().encode(s);
const body = text('invented site '.repeat(500));

describe('zipEntries', () => {
  it('reads stored and deflated entries as fflate wrote them, and only the wanted ones', () => {
    const zip = zipSync({ 'a.txt': [body, { level: 0 }], 'dir/b.txt': [body, { level: 9 }], '__MACOSX/._a.txt': text('x') });
    expect(zipEntryPaths('z.zip', zip)).toEqual(['a.txt', 'dir/b.txt']);
    const all = zipEntries('z.zip', zip);
    expect(Object.keys(all)).toEqual(['a.txt', 'dir/b.txt']);
    expect(all['dir/b.txt']).toEqual(body);
    expect(Object.keys(zipEntries('z.zip', zip, (p) => p.endsWith('b.txt')))).toEqual(['dir/b.txt']);
  });

  it('refuses, before inflating, an entry that declares more than the per-entry limit', () => {
    expect(() => zipEntries('z.kmz', zipWithDeclaredSize('doc.kml', body, 300 * 1024 * 1024))).toThrow(
      "z.kmz: doc.kml: inflates to 300 MiB; stratplot's limit is 256 MiB per file in an archive",
    );
  });

  it('refuses an entry that inflates past, or short of, the size its header states', () => {
    expect(() => zipEntries('z.zip', zipWithDeclaredSize('a.txt', body, 100))).toThrow('z.zip: not a readable zip archive (a.txt inflates to more than the 100 bytes its header states)');
    expect(() => zipEntries('z.zip', zipWithDeclaredSize('a.txt', body, body.length + 5))).toThrow(`a.txt inflates to ${body.length.toLocaleString('en-US')} bytes, not the`);
  });

  it('names encrypted entries, unknown methods and bytes that are no zip', () => {
    const zip = zipSync({ 'a.txt': [body, { level: 9 }] }).slice();
    const view = new DataView(zip.buffer);
    const cd = view.getUint32(zip.length - 22 + 16, true);
    view.setUint16(cd + 8, 1, true);
    expect(() => zipEntries('z.zip', zip)).toThrow('z.zip: a.txt is encrypted; save the archive without a password');
    view.setUint16(cd + 8, 0, true);
    view.setUint16(cd + 10, 12, true);
    expect(() => zipEntries('z.zip', zip)).toThrow('uses zip compression method 12');
    expect(() => zipEntries('z.zip', text('not a zip at all'))).toThrow('z.zip: not a readable zip archive (no end-of-archive record)');
  });
});
