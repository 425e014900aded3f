import type { FeatureCollection } from 'geojson';
import type { Map as MapLibreMap } from 'maplibre-gl';
import { describe, expect, it } from 'vitest';
import { plotCollectionInvented } from '../../core/field/plotCollectionInvented';
import { plannerStoreCreate } from '../../state/plannerStore';
import { resultsColouringSet } from '../../state/resultsStore';
import { TEST_DESIGN } from '../../state/testDesign';
import { resultsColourSource, resultsMapLayerInstall } from './resultsMapLayer';
import { resultsStore } from './resultsStoreInstance';

// Invented plot file (not a real site).
const plots = plotCollectionInvented([{ key: 'Coastal heath', code: 'HEA', primaries: 3, reserves: 1, mappedM2: 50_000, usableM2: 50_000 }]);

/** The few map calls the layer makes, recording the data it is given. */
function fakeMap() {
  const data: FeatureCollection[] = [];
  const map = {
    addSource: () => undefined,
    addLayer: () => undefined,
    getLayer: () => undefined,
    getSource: () => ({ setData: (d: FeatureCollection) => data.push(d) }),
  };
  return { map: map as unknown as MapLibreMap, data };
}

describe('resultsMapLayer', () => {
  it('puts only coloured plots on the map, at their own positions', () => {
    const fc = resultsColourSource(plots, { variable: 'cover', colours: { 'HEA-02': '#440154' }, min: 0, max: 1 });
    expect(fc.features).toEqual([{ type: 'Feature', geometry: plots.features[1].geometry, properties: { plot_id: 'HEA-02', colour: '#440154' } }]);
    expect(resultsColourSource(plots, null).features).toEqual([]);
  });

  it('follows the results colouring and drops it when a new design replaces the plots', () => {
    const planner = plannerStoreCreate(TEST_DESIGN);
    planner.setState({ result: plots });
    const { map, data } = fakeMap();
    const off = resultsMapLayerInstall(map, planner);
    resultsColouringSet(resultsStore, { variable: 'cover', colours: { 'HEA-01': '#fde725' }, min: 0, max: 1 });
    expect(data.at(-1)?.features.map((f) => f.properties?.plot_id)).toEqual(['HEA-01']);
    planner.setState({ result: plotCollectionInvented([{ key: 'Coastal heath', code: 'HEA', primaries: 3, reserves: 0, mappedM2: 9, usableM2: 9 }]) });
    expect(resultsStore.getState().colouring).toBeNull();
    expect(data.at(-1)?.features).toEqual([]);
    off();
  });
});
