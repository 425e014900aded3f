import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readInputFile } from './readInput';

const dir = mkdtempSync(join(tmpdir(), 'stratplot-read-'));
writeFileSync(join(dir, 'a.geojson'), '{"type":"FeatureCollection","features":[]}');
const io = { out: () => {}, err: () => {}, cwd: dir };

describe('readInputFile', () => {
  it('reads a file relative to the working directory and keeps the path as given', async () => {
    const { name, bytes } = await readInputFile(io, 'a.geojson');
    expect(name).toBe('a.geojson');
    expect(new TextDecoder().decode(bytes)).toBe('{"type":"FeatureCollection","features":[]}');
  });

  it('says which file is missing and when a folder was given', async () => {
    await expect(readInputFile(io, 'none.geojson')).rejects.toThrow('file not found: none.geojson');
    await expect(readInputFile(io, '.')).rejects.toThrow('. is a folder, not a file');
  });
});
