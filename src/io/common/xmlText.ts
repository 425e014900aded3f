/** The string without characters outside XML 1.0's Char production (C0 controls but tab/LF/CR, lone surrogates, U+FFFE/F). */
function xmlChars(s: string): string {
  let out = '';
  for (const ch of s) {
    const c = ch.codePointAt(0)!;
    const control = c < 0x20 && c !== 0x09 && c !== 0x0a && c !== 0x0d;
    const surrogate = c >= 0xd800 && c <= 0xdfff;
    if (!control && !surrogate && c !== 0xfffe && c !== 0xffff) out += ch;
  }
  return out;
}

/**
 * Text escaped for XML 1.0 element content and attribute values: markup characters as entities,
 * CR and tab as character references (so they survive attribute-value and line-end
 * normalisation), and characters XML 1.0 forbids (other C0 controls, lone surrogates, U+FFFE/F)
 * dropped. Source: W3C XML 1.0 (5th ed.), §2.2 Char, §2.11 end-of-line handling, §3.3.3.
 */
export function xmlText(value: unknown): string {
  const s = typeof value === 'string' ? value : value === null || value === undefined ? '' : String(value);
  return xmlChars(s)
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&apos;')
    .replace(/\r/g, '&#13;')
    .replace(/\t/g, '&#9;');
}

/** A coordinate as an xsd:decimal (no exponent), shortest text that reads back to the same double. */
export function xmlDecimal(v: number): string {
  const s = String(v);
  if (!s.includes('e')) return s;
  return v.toFixed(20).replace(/0+$/, '').replace(/\.$/, '');
}
