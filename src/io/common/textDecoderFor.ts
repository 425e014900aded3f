/*
 * Code points of bytes 0x80–0x9F in windows-1252, from the WHATWG Encoding Standard's
 * index-windows-1252 (undefined slots map to the C1 control of the same value, as the index does).
 */
const CP1252_HIGH = [
  0x20ac, 0x81, 0x201a, 0x192, 0x201e, 0x2026, 0x2020, 0x2021, 0x2c6, 0x2030, 0x160, 0x2039, 0x152, 0x8d, 0x17d, 0x8f,
  0x90, 0x2018, 0x2019, 0x201c, 0x201d, 0x2022, 0x2013, 0x2014, 0x2dc, 0x2122, 0x161, 0x203a, 0x153, 0x9d, 0x17e, 0x178,
];

function decodeWindows1252(bytes: Uint8Array): string {
  let out = '';
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i];
    out += String.fromCharCode(b >= 0x80 && b < 0xa0 ? CP1252_HIGH[b - 0x80] : b);
  }
  return out;
}

/**
 * A bytes → text function for an encoding label. windows-1252 is decoded here from the WHATWG
 * table because some runtimes (Node 20) decode it as ISO-8859-1 and lose €, curly quotes and
 * dashes; every other label goes to TextDecoder. `fatal` makes invalid bytes throw.
 * Throws RangeError for a label the runtime does not know.
 */
export function textDecoderFor(label: string, fatal = false): (bytes: Uint8Array) => string {
  if (label.toLowerCase() === 'windows-1252') return decodeWindows1252;
  const decoder = new TextDecoder(label, { fatal });
  return (bytes) => decoder.decode(bytes);
}
