import type { Footprint } from '../model/designTypes';
import { InputError } from '../common/InputError';

const NUMBER = '(\\d+(?:\\.\\d+)?)';
const ANGLE = `(?:@(-?\\d+(?:\\.\\d+)?))?`;
const SQUARE = new RegExp(`^square:${NUMBER}${ANGLE}$`);
const RECT = new RegExp(`^rect:${NUMBER}x${NUMBER}${ANGLE}$`);
const CIRCLE = new RegExp(`^circle:${NUMBER}$`);

/**
 * Reads a footprint written as `point`, `square:S[@A]`, `rect:WxH[@A]` or `circle:R` (metres;
 * A = rotation in degrees clockwise from true north, 0 when absent: edges run north–south and
 * east–west). For a rectangle W runs east–west and H north–south before rotation.
 * @param text the footprint as the user typed it
 * @param where what to name in the message (e.g. "--footprint")
 * Throws InputError saying what is wrong when the text does not match or a size is not > 0.
 */
export function footprintParse(text: string, where = 'footprint'): Footprint {
  const t = text.trim().toLowerCase();
  if (t === 'point' || t === '') return { shape: 'point' };
  let m = SQUARE.exec(t);
  if (m) return { shape: 'square', sideM: positive(m[1], where, 'side'), angleDeg: angle(m[2]) };
  m = RECT.exec(t);
  if (m) return { shape: 'rect', widthM: positive(m[1], where, 'width'), heightM: positive(m[2], where, 'height'), angleDeg: angle(m[3]) };
  m = CIRCLE.exec(t);
  if (m) return { shape: 'circle', radiusM: positive(m[1], where, 'radius') };
  throw new InputError(
    `${where} "${text}" is not understood; write point, square:SIDE[@ANGLE], rect:WIDTHxHEIGHT[@ANGLE] or circle:RADIUS (metres, angle in degrees clockwise from true north)`,
  );
}

function positive(v: string, where: string, what: string): number {
  const x = Number(v);
  if (!(x > 0)) throw new InputError(`${where}: the ${what} must be more than 0 m, got ${v}`);
  return x;
}

function angle(v: string | undefined): number {
  if (v === undefined) return 0;
  const a = Number(v) % 180;
  return a < 0 ? a + 180 : a;
}

/** Ground area of one plot in m² (0 for a point). */
export function footprintAreaM2(fp: Footprint): number {
  switch (fp.shape) {
    case 'point':
      return 0;
    case 'square':
      return fp.sideM * fp.sideM;
    case 'rect':
      return fp.widthM * fp.heightM;
    case 'circle':
      return Math.PI * fp.radiusM * fp.radiusM;
  }
}

/** The footprint written back the way {@link footprintParse} reads it. */
export function footprintFormat(fp: Footprint): string {
  switch (fp.shape) {
    case 'point':
      return 'point';
    case 'square':
      return `square:${fp.sideM}${fp.angleDeg ? `@${fp.angleDeg}` : ''}`;
    case 'rect':
      return `rect:${fp.widthM}x${fp.heightM}${fp.angleDeg ? `@${fp.angleDeg}` : ''}`;
    case 'circle':
      return `circle:${fp.radiusM}`;
  }
}
