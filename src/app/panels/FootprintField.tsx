import { useId } from 'react';
import type { Footprint } from '../../core/model/designTypes';
import { footprintAreaM2, footprintFormat } from '../../core/design/footprintParse';
import { InputError } from '../../core/common/InputError';
import { designSettingsSet } from '../../state/designActions';
import { plannerStore } from '../plannerStoreInstance';
import { attempt, usePlanner } from '../usePlanner';
import { NumberField } from './NumberField';

type Shape = Footprint['shape'];
const SHAPES: [Shape, string][] = [
  ['point', 'a point (no footprint)'],
  ['square', 'a square'],
  ['rect', 'a rectangle'],
  ['circle', 'a circle'],
];

const round = (x: number) => Math.round(x * 100) / 100;

/** The footprint of another shape with the same ground area (a point becomes a 20 m square). */
export function footprintReshape(fp: Footprint, shape: Shape): Footprint {
  const area = footprintAreaM2(fp) || 400;
  const angleDeg = fp.shape === 'square' || fp.shape === 'rect' ? fp.angleDeg : 0;
  switch (shape) {
    case 'point':
      return { shape: 'point' };
    case 'square':
      return { shape: 'square', sideM: fp.shape === 'square' ? fp.sideM : round(Math.sqrt(area)), angleDeg };
    case 'rect':
      return fp.shape === 'square' ? { shape: 'rect', widthM: fp.sideM, heightM: fp.sideM, angleDeg } : { shape: 'rect', widthM: round(Math.sqrt(area)), heightM: round(Math.sqrt(area)), angleDeg };
    case 'circle':
      return { shape: 'circle', radiusM: round(Math.sqrt(area / Math.PI)) };
  }
}

function sized(what: string, v: number | null, patch: (v: number) => Footprint): Footprint {
  if (v === null || !(v > 0)) throw new InputError(`plot footprint: the ${what} must be more than 0 m`);
  return patch(v);
}

/**
 * The plot footprint as a shape and its sizes: point, square (side), rectangle (width east–west
 * and length north–south before turning) or circle (radius), turned clockwise from true north.
 * The same footprint in the command line's words is shown beneath.
 */
export function FootprintField() {
  const fp = usePlanner((s) => s.design.footprint);
  const id = useId();
  const set = (make: () => Footprint) => attempt(() => designSettingsSet(plannerStore, { footprint: make() }));
  const area = footprintAreaM2(fp);
  return (
    <div className="footprint">
      <div className="field">
        <label htmlFor={`${id}-shape`}>Plot footprint</label>
        <select id={`${id}-shape`} value={fp.shape} onChange={(e) => set(() => footprintReshape(fp, e.currentTarget.value as Shape))}>
          {SHAPES.map(([v, t]) => (
            <option key={v} value={v}>
              {t}
            </option>
          ))}
        </select>
      </div>
      {fp.shape === 'square' ? <NumberField label="Side" unit="m" min={0} value={fp.sideM} onCommit={(v) => set(() => sized('side', v, (x) => ({ ...fp, sideM: x })))} /> : null}
      {fp.shape === 'rect' ? (
        <>
          <NumberField label="Width (east–west)" unit="m" min={0} value={fp.widthM} onCommit={(v) => set(() => sized('width', v, (x) => ({ ...fp, widthM: x })))} />
          <NumberField label="Length (north–south)" unit="m" min={0} value={fp.heightM} onCommit={(v) => set(() => sized('length', v, (x) => ({ ...fp, heightM: x })))} />
        </>
      ) : null}
      {fp.shape === 'circle' ? <NumberField label="Radius" unit="m" min={0} value={fp.radiusM} onCommit={(v) => set(() => sized('radius', v, (x) => ({ ...fp, radiusM: x })))} /> : null}
      {fp.shape === 'square' || fp.shape === 'rect' ? (
        <NumberField
          label="Rotation"
          unit="° clockwise from true north"
          value={fp.angleDeg}
          onCommit={(v) => set(() => ({ ...fp, angleDeg: ((((v ?? 0) % 180) + 180) % 180) }))}
        />
      ) : null}
      <p className="fine">
        {fp.shape === 'point' ? 'Plots are points: only the spacing keeps them apart and clear of exclusions.' : `${area.toLocaleString('en', { maximumFractionDigits: 1 })} m² per plot; the whole footprint stays inside its stratum and clear of every buffer.`} Command line:{' '}
        <code>--footprint {footprintFormat(fp)}</code>
      </p>
    </div>
  );
}
