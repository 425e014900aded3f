import { createHash } from 'node:crypto';
import { planFileFromState, planFileOf } from './planFile';
import { describe, expect, it } from 'vitest';
import { designSettingsDefault } from '../core/design/designSettingsDefault';
import type { PlanFile } from './planFileTypes';
import { AUTOSAVE_KEY, AUTOSAVE_UNREADABLE_KEY, type AutosaveStorage, autosaveRestore, autosaveStart } from './autosave';
import { VERSIONS_KEY, workVersionRead, workVersionsKeeper, workVersionsList } from './autosaveVersions';
import { planReplace } from './planReplace';
import { type PlanRecord, planRecordHashText, planRecordText } from '../io/common/planRecordText';
import { plannerStoreCreate, siteEmpty } from './plannerStore';
import { stratumPartAdd } from './strataActions';

// Invented strata (not a real site).
const box = (w: number) => ({ type: 'Polygon' as const, coordinates: [[[w, -35], [w + 0.001, -35], [w + 0.001, -34.999], [w, -34.999], [w, -35]]] });

function memoryStorage(): AutosaveStorage & { data: Map<string, unknown> } {
  const data = new Map<string, unknown>();
  return { data, get: async (k) => data.get(k), set: async (k, v) => void data.set(k, v), del: async (k) => void data.delete(k) };
}

const other: PlanFile = planFileOf(siteEmpty('Other site (invented)'), designSettingsDefault());
const settle = () => new Promise((r) => setTimeout(r, 30));

describe('earlier versions of the work in the browser', () => {
  it('keeps the work a plan replacement left, with its time and a summary, and brings it back', async () => {
    const storage = memoryStorage();
    const store = plannerStoreCreate(designSettingsDefault());
    const { stop } = autosaveStart(store, storage, 5);
    stratumPartAdd(store, 'Heath', box(150));
    await settle();
    stratumPartAdd(store, 'Marsh', box(150.001));
    await settle();
    planReplace(store, other, designSettingsDefault(), 'other.stratplot.json', true);
    await stop();
    const list = await workVersionsList(storage);
    expect(list.map((v) => v.siteName)).toEqual(['Other site (invented)', 'Untitled site']);
    // The edits of one plan within a few minutes are one version: its latest state.
    expect(list[1].summary).toBe('2 strata, 0 exclusions, 0 access points; no design yet');
    expect(Date.parse(list[1].at)).toBeGreaterThanOrEqual(Date.parse(list[1].since));
    const back = await workVersionRead(storage, list[1].id);
    expect(back.plan.site.strata.map((s) => s.key)).toEqual(['Heath', 'Marsh']);
  });

  it('stores the plan with its save time and hashes it without, by SHA-256 of its text (node:crypto)', async () => {
    const storage = memoryStorage();
    const hashed: string[] = [];
    // The storage's own hashing (the browser's worker) is used when it has one.
    const withHash: AutosaveStorage = {
      ...storage,
      textSha256: async (t) => {
        hashed.push(t);
        return createHash('sha256').update(t, 'utf8').digest('hex');
      },
    };
    const store = plannerStoreCreate(designSettingsDefault());
    const { flush } = autosaveStart(store, withHash, 5);
    stratumPartAdd(store, 'Kōwhai scrub — north', box(150));
    await flush();
    const record = JSON.parse(storage.data.get(AUTOSAVE_KEY) as string);
    const expected = planFileFromState(store.getState(), record.plan.savedAt);
    expect(Date.parse(record.plan.savedAt)).toBeGreaterThan(0);
    expect(record.plan).toEqual(JSON.parse(JSON.stringify(expected)));
    expect(record.saved).toBe(false);
    // The hashed text is the same plan with savedAt "" (names escaped above Latin-1, RFC 8259 §7).
    expect(hashed).toHaveLength(1);
    expect(JSON.parse(hashed[0])).toEqual(JSON.parse(JSON.stringify({ ...expected, savedAt: '' })));
    expect(/[\u0100-\uffff]/.test(hashed[0])).toBe(false);
    const [version] = await workVersionsList(storage);
    // FIPS 180-4 SHA-256 as Node's crypto (OpenSSL) computes it, of the UTF-8 bytes.
    expect(version.hash).toBe(createHash('sha256').update(hashed[0], 'utf8').digest('hex'));
  });

  it('hands a storage that puts records together the plan text once, for the working copy, the version and the hash', async () => {
    const storage = memoryStorage();
    const records: [string, PlanRecord][] = [];
    const hashed: string[] = [];
    // Stands in for the browser's storage worker: it writes each record's text itself.
    const composing: AutosaveStorage = {
      ...storage,
      setRecord: async (k, r) => {
        records.push([k, r]);
        storage.data.set(k, planRecordText(r));
      },
      recordSha256: async (r) => {
        hashed.push(planRecordHashText(r));
        return createHash('sha256').update(planRecordHashText(r), 'utf8').digest('hex');
      },
    };
    const store = plannerStoreCreate(designSettingsDefault());
    const { flush } = autosaveStart(store, composing, 5);
    stratumPartAdd(store, 'Kōwhai scrub — north', box(150));
    await flush();
    const [version] = await workVersionsList(storage);
    const stored0 = () => JSON.parse(storage.data.get(AUTOSAVE_KEY) as string).plan;
    expect(records.map(([k]) => k)).toEqual([AUTOSAVE_KEY, `${VERSIONS_KEY}:${version.id}`]);
    expect(records[1][1]).toBe(records[0][1]);
    expect(hashed).toEqual([planRecordHashText(records[0][1])]);
    // FIPS 180-4 SHA-256 as Node's crypto (OpenSSL) computes it, of the plan's text without its save time.
    expect(JSON.parse(hashed[0])).toEqual({ ...stored0(), savedAt: '' });
    expect(version.hash).toBe(createHash('sha256').update(hashed[0], 'utf8').digest('hex'));
    const stored = JSON.parse(storage.data.get(AUTOSAVE_KEY) as string);
    expect(stored.plan).toEqual(JSON.parse(JSON.stringify(planFileFromState(store.getState(), records[0][1].savedAt))));
    expect(storage.data.get(`${VERSIONS_KEY}:${version.id}`)).toBe(storage.data.get(AUTOSAVE_KEY));
    // The working copy comes back from the text the storage put together.
    const again = plannerStoreCreate(designSettingsDefault());
    expect(await autosaveRestore(again, storage, designSettingsDefault())).toBe(true);
    expect(again.getState().site.strata.map((x) => x.label)).toEqual(['Kōwhai scrub — north']);
  });

  it('lists the same work once, at its latest time, and keeps at most the newest few', async () => {
    const storage = memoryStorage();
    const keep = workVersionsKeeper(storage, 3);
    const plan = (n: number): PlanFile => ({ ...other, site: siteEmpty(`Site ${n} (invented)`) });
    for (let i = 0; i < 5; i++) await keep(JSON.stringify({ plan: plan(i), saved: false }), plan(i), `s#${i}`, new Date(Date.UTC(2026, 11, 1, 10, i)));
    await keep(JSON.stringify({ plan: plan(3), saved: false }), plan(3), 's#9', new Date(Date.UTC(2026, 11, 1, 11, 0)));
    const list = await workVersionsList(storage);
    expect(list.map((v) => v.siteName)).toEqual(['Site 3 (invented)', 'Site 4 (invented)', 'Site 2 (invented)']);
    expect(list[0].at).toBe('2026-12-01T11:00:00.000Z');
    // Versions that fell off the list are deleted, not left behind.
    const kept = [...storage.data.keys()].filter((k) => k.startsWith(`${VERSIONS_KEY}:`));
    expect(kept).toHaveLength(3);
  });

  it('begins a new version when the same plan has been edited for longer than the window', async () => {
    const storage = memoryStorage();
    const keep = workVersionsKeeper(storage, 10, 60_000);
    const at = (min: number) => new Date(Date.UTC(2026, 11, 1, 10, min));
    const plan = (n: number): PlanFile => ({ ...other, design: designSettingsDefault({ plots: n }) });
    await keep('{}', plan(1), 'a#1', at(0));
    await keep('{}', plan(2), 'a#1', at(0.5));
    await keep('{}', plan(3), 'a#1', at(2));
    expect((await workVersionsList(storage)).length).toBe(2);
  });

  it('sets a browser copy it cannot read aside, so later work does not overwrite it', async () => {
    const storage = memoryStorage();
    const newer = JSON.stringify({ plan: { ...other, version: 99 }, saved: false });
    storage.data.set(AUTOSAVE_KEY, newer);
    const store = plannerStoreCreate(designSettingsDefault());
    await expect(autosaveRestore(store, storage, designSettingsDefault())).rejects.toThrow('the browser copy of your work: plan version 99 is not one this program reads (it reads versions 1 to 2)');
    expect(storage.data.get(AUTOSAVE_UNREADABLE_KEY)).toBe(newer);
    storage.data.set(AUTOSAVE_KEY, '{"plan": ');
    await expect(autosaveRestore(store, storage, designSettingsDefault())).rejects.toThrow('the browser copy of your work is damaged and could not be read');
    expect(storage.data.get(AUTOSAVE_UNREADABLE_KEY)).toBe('{"plan": ');
    expect(store.getState().site.name).toBe('Untitled site');
  });
});
