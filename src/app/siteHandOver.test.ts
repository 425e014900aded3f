import { afterEach, describe, expect, it } from 'vitest';
import type { Site } from '../core/model/types';
import { siteTextReceive } from '../worker/siteSource';
import { siteHolderSet, siteSourceFor } from './siteHandOver';
import { siteJsonOf } from './siteJson';

const siteOf = (name: string): Site => ({
  name: `${name} (invented)`,
  strata: [{ key: 'Heath', label: 'Heath', code: 'HEA', colour: '#cc6677' }],
  parts: [{ id: 'p1', stratum: 'Heath', geometry: { type: 'Polygon', coordinates: [[[150, -35], [150.01, -35], [150.01, -34.99], [150, -34.99], [150, -35]]] } }],
  exclusions: [],
  access: [],
  boundary: null,
});

afterEach(() => siteHolderSet(null));

describe('handing a site to a planner worker', () => {
  it('gives a port on which the holding worker posts the text when it holds this very site', async () => {
    const site = siteOf('Held site');
    const asked: MessagePort[] = [];
    // Stands in for the analysis worker: it answers with the text it was sent.
    siteHolderSet({ site, handOver: (port) => (asked.push(port), port.postMessage(siteJsonOf(site))) });
    const source = siteSourceFor(site);
    expect(typeof source).not.toBe('string');
    expect(asked).toHaveLength(1);
    const text = await siteTextReceive(source);
    expect(JSON.parse(text)).toEqual(site);
    asked[0].close();
  });

  it('gives the text itself when the holder holds another site (an edit not yet sent) or there is no holder', async () => {
    const sent = siteOf('Sent site');
    const edited = siteOf('Edited site');
    const source = siteSourceFor(edited);
    expect(source).toBe(siteJsonOf(edited));
    siteHolderSet({ site: sent, handOver: () => expect.unreachable('the holder must not be asked for another site') });
    expect(await siteTextReceive(siteSourceFor(edited))).toBe(siteJsonOf(edited));
  });

  it('fails with a message when the holder answers that it holds no site', async () => {
    const { port1, port2 } = new MessageChannel();
    port1.postMessage(null);
    await expect(siteTextReceive(port2)).rejects.toThrow('the site was not handed over');
    port1.close();
  });
});
