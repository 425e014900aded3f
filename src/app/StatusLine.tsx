import { useEffect, useState } from 'react';
import { type LocalFrame, localFrameAt } from '../core/geo/localFrame';
import { stratumNamesInText } from '../core/field/stratumNamesInText';
import { mapWhenReady } from './map/mapHandle';
import { plannerStore } from './plannerStoreInstance';
import { usePlanner } from './usePlanner';

const frames = new Map<string, LocalFrame>();

function utmText(lon: number, lat: number): string {
  if (lat < -80 || lat > 84) return 'outside UTM';
  const probe = localFrameAt(lon, lat);
  const frame = frames.get(probe.utmZone) ?? probe;
  frames.set(probe.utmZone, frame);
  const [x, y] = frame.toXY(lon, lat);
  return `UTM ${frame.utmZone} ${x.toFixed(0)} E ${y.toFixed(0)} N`;
}

/** The line under the map: cursor position (lat/lon and UTM), what just happened, and any error. */
export function StatusLine() {
  const [cursor, setCursor] = useState<string>('Move the pointer over the map for coordinates');
  const notice = usePlanner((s) => s.notice);
  const strata = usePlanner((s) => s.site.strata);
  useEffect(
    () =>
      mapWhenReady((map) => {
        map.on('mousemove', (e) => {
          const { lng, lat } = e.lngLat;
          setCursor(`${lat.toFixed(6)}°, ${lng.toFixed(6)}°  ·  ${utmText(lng, lat)}`);
        });
      }),
    [],
  );
  return (
    <footer className="status-line">
      <output className="cursor-pos" aria-label="Pointer position">
        {cursor}
      </output>
      <output className={notice?.tone === 'error' ? 'notice notice-error' : 'notice'} aria-live="polite">
        {notice ? (
          <>
            {notice.tone === 'error' ? <strong>Problem: </strong> : null}
            {stratumNamesInText(notice.text, strata)}
            <button type="button" className="link" aria-label="Dismiss message" onClick={() => plannerStore.setState({ notice: null })}>
              dismiss
            </button>
          </>
        ) : null}
      </output>
    </footer>
  );
}
