import { useId, useState } from 'react';
import { BASE_CAUTION } from '../map/baseStyle';
import { imageryOpacity, imageryRemove } from '../map/imageryControl';
import { mapHandle } from '../map/mapHandle';
import { onlineTilesSwitch } from '../map/onlineTilesControl';
import { imageryLoadGeotiff, imageryLoadWorldFile } from '../imageryLoad';
import { plannerStore } from '../plannerStoreInstance';
import { notify, usePlanner } from '../usePlanner';

/** What lies under the strata: the user's own imagery (read here, never uploaded) and optional online tiles. */
export function BackdropBox() {
  const ids = { tif: useId(), png: useId(), wld: useId(), epsg: useId(), op: useId(), online: useId() };
  const imagery = usePlanner((s) => s.imagery);
  const online = usePlanner((s) => s.onlineTiles);
  const [png, setPng] = useState<File | null>(null);
  const [wld, setWld] = useState<File | null>(null);
  const [epsg, setEpsg] = useState('');
  const placeWorldFile = () => {
    const code = Number(epsg);
    if (!png || !wld) return notify('error', 'choose both the image and its world file (.pgw, .jgw or .wld)');
    if (!Number.isInteger(code) || code <= 0) return notify('error', `EPSG code "${epsg}" is not a whole number: world files carry no coordinate system, so give its code`);
    void imageryLoadWorldFile(png, wld, code);
  };
  return (
    <details className="backdrop">
      <summary>Imagery and backdrop</summary>
      <p className="fine">Images are read on this computer and never uploaded.</p>
      <div className="field">
        <label htmlFor={ids.tif} className="file-label">
          Show a GeoTIFF
        </label>
        <input id={ids.tif} className="file-input" type="file" accept=".tif,.tiff" onChange={async (e) => {
          const f = e.currentTarget.files?.[0];
          e.currentTarget.value = '';
          if (f) await imageryLoadGeotiff(f.name, new Uint8Array(await f.arrayBuffer()));
        }} />
      </div>
      <div className="field world-file">
        <label htmlFor={ids.png}>PNG/JPEG</label>
        <input id={ids.png} type="file" accept=".png,.jpg,.jpeg" onChange={(e) => setPng(e.currentTarget.files?.[0] ?? null)} />
        <label htmlFor={ids.wld}>World file</label>
        <input id={ids.wld} type="file" accept=".pgw,.jgw,.wld,.tfw,.pngw,.jpgw" onChange={(e) => setWld(e.currentTarget.files?.[0] ?? null)} />
        <label htmlFor={ids.epsg}>EPSG</label>
        <input id={ids.epsg} className="num-input" inputMode="numeric" placeholder="e.g. 32750" value={epsg} onChange={(e) => setEpsg(e.currentTarget.value)} />
        <button type="button" onClick={placeWorldFile}>
          Place image
        </button>
      </div>
      {imagery ? (
        <div className="field">
          <label htmlFor={ids.op}>Opacity of {imagery.label}</label>
          <input
            id={ids.op}
            type="range"
            min={0}
            max={1}
            step={0.05}
            value={imagery.opacity}
            onChange={(e) => {
              const opacity = Number(e.currentTarget.value);
              const map = mapHandle();
              if (map) imageryOpacity(map, opacity);
              plannerStore.setState({ imagery: { ...imagery, opacity } });
            }}
          />
          <span className="fine">{imagery.pixelSizeM.toFixed(2)} m pixels</span>
          <button
            type="button"
            onClick={() => {
              const map = mapHandle();
              if (map) imageryRemove(map);
              plannerStore.setState({ imagery: null });
            }}
          >
            Remove
          </button>
        </div>
      ) : null}
      <div className="field">
        <input
          id={ids.online}
          type="checkbox"
          checked={online.enabled}
          onChange={async (e) => {
            const on = e.currentTarget.checked;
            const map = mapHandle();
            if (!map) return;
            plannerStore.setState({ onlineTiles: { enabled: on, status: on ? 'checking…' : 'off' } });
            const status = await onlineTilesSwitch(map, on);
            plannerStore.setState({ onlineTiles: { enabled: on, status } });
          }}
        />
        <label htmlFor={ids.online}>Online map tiles (OpenStreetMap; needs a connection)</label>
        <output className="fine"> {online.status}</output>
      </div>
      <p className="fine">{BASE_CAUTION}</p>
    </details>
  );
}
