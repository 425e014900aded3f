import { describe, expect, it } from 'vitest';
import { declinationText, degreesMinutesText, mgrsSpacedText, utmText } from './coordinateText';

describe('coordinate text', () => {
  it('writes degrees and decimal minutes as GeoConvert does', () => {
    // GeographicLib GeoConvert -d -p 1 on "-34.4456 119.1021": 34d26'44.16"S 119d06'07.56"E,
    // that is 26 + 44.16/60 = 26.7360 and 6 + 7.56/60 = 6.1260 minutes.
    expect(degreesMinutesText(-34.4456, 'lat')).toBe('34° 26.7360′ S');
    expect(degreesMinutesText(119.1021, 'lon')).toBe('119° 06.1260′ E');
  });

  it('carries 59.99995 minutes into the next degree', () => {
    expect(degreesMinutesText(10.9999999, 'lat')).toBe('11° 00.0000′ N');
  });

  it('spaces an MGRS reference into zone-band, square, easting, northing', () => {
    // GeoConvert -m -p 0 and the mgrs package (2.2.0) agree on 50HPG9312086430 for -34.4456, 119.1021.
    expect(mgrsSpacedText('50HPG9312086430')).toBe('50H PG 93120 86430');
    expect(mgrsSpacedText('not mgrs')).toBe('not mgrs');
  });

  it('spells the UTM hemisphere out so it is not read as an MGRS band', () => {
    expect(utmText('50S', 693118.4, 6186444.6)).toBe('zone 50 south, 693118 E 6186445 N');
    expect(declinationText(-0.851)).toBe('0.85° W');
  });
});
