import { describe, expect, it } from 'vitest';
import { textDecoderFor } from './textDecoderFor';

describe('textDecoderFor', () => {
  it('decodes the windows-1252 high range per the WHATWG index (€ 0x80, curly quotes 0x93/0x94, en dash 0x96, Ÿ 0x9F)', () => {
    // WHATWG Encoding Standard, index-windows-1252: pointers 0, 19, 20, 22, 31 → U+20AC, U+201C, U+201D, U+2013, U+0178.
    const text = textDecoderFor('windows-1252')(Uint8Array.from([0x80, 0x93, 0x94, 0x96, 0x9f, 0xe9]));
    expect(text).toBe('€“”–Ÿé');
  });

  it('throws on invalid UTF-8 only when asked to be strict', () => {
    const bad = Uint8Array.from([0x46, 0xea, 0x74]);
    expect(() => textDecoderFor('utf-8', true)(bad)).toThrow();
    expect(textDecoderFor('utf-8')(bad)).toBe('F\uFFFDt');
  });
});
