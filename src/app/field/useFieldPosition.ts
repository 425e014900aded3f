import { useEffect, useState } from 'react';
import type { PositionFix } from '../../core/model/fieldTypes';

/** The device's live position and compass, as the field view uses them. */
export interface FieldPosition {
  fix: PositionFix | null;
  /** Why there is no position, in words for the crew ("waiting for a position", "location is not allowed…"); "live" with one. */
  status: string;
  /** Compass heading from magnetic north, degrees, when the device gives one; else null. */
  headingMagDeg: number | null;
  /** Asks for the compass where the browser wants a tap first (iOS); null where no asking is needed. */
  compassAsk: (() => void) | null;
}

type OrientationPermission = { requestPermission?: () => Promise<'granted' | 'denied'> };

type OrientationEvent = DeviceOrientationEvent & { webkitCompassHeading?: number };

/**
 * Watches the browser's geolocation (high accuracy, no cached fixes older than 10 s) and the
 * device compass. Without geolocation, or when it is refused, `fix` stays null and `status` says
 * why: the field view then lists plots with their coordinates and still records them.
 */
export function useFieldPosition(): FieldPosition {
  const [fix, setFix] = useState<PositionFix | null>(null);
  const [status, setStatus] = useState('waiting for a position');
  const [headingMagDeg, setHeading] = useState<number | null>(null);
  const [asked, setAsked] = useState(false);
  const needsAsk = typeof window !== 'undefined' && typeof (window.DeviceOrientationEvent as unknown as OrientationPermission | undefined)?.requestPermission === 'function';

  useEffect(() => {
    const geo = typeof navigator !== 'undefined' ? navigator.geolocation : undefined;
    if (!geo) {
      setStatus('this browser gives none (record plots by their coordinates)');
      return;
    }
    const id = geo.watchPosition(
      (p) => {
        setFix({ lon: p.coords.longitude, lat: p.coords.latitude, accuracyM: p.coords.accuracy, atIso: new Date(p.timestamp || Date.now()).toISOString() });
        setStatus('live');
      },
      (e) => {
        setStatus(
          e.code === e.PERMISSION_DENIED
            ? 'location is not allowed for this page (allow it in the browser settings)'
            : 'the device has no fix yet (under cover or indoors?)',
        );
      },
      { enableHighAccuracy: true, maximumAge: 10_000, timeout: 60_000 },
    );
    return () => geo.clearWatch(id);
  }, []);

  useEffect(() => {
    const onTurn = (e: Event) => {
      const o = e as OrientationEvent;
      // iOS gives the compass heading directly; elsewhere an absolute alpha counts anticlockwise from north.
      if (typeof o.webkitCompassHeading === 'number') setHeading(o.webkitCompassHeading);
      else if (o.absolute && typeof o.alpha === 'number') setHeading((360 - o.alpha) % 360);
    };
    const kind = 'ondeviceorientationabsolute' in window ? 'deviceorientationabsolute' : 'deviceorientation';
    window.addEventListener(kind, onTurn);
    return () => window.removeEventListener(kind, onTurn);
  }, []);

  const compassAsk =
    needsAsk && !asked && headingMagDeg === null
      ? () => {
          setAsked(true);
          // The events start once allowed; a refusal leaves the north-up dial.
          void (window.DeviceOrientationEvent as unknown as OrientationPermission).requestPermission?.().catch(() => undefined);
        }
      : null;
  return { fix, status, headingMagDeg, compassAsk };
}
