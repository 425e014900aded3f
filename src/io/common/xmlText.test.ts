import { describe, expect, it } from 'vitest';
import { xmlParse } from './xmlParse';
import { xmlDecimal, xmlText } from './xmlText';

describe('xmlText', () => {
  it('escapes markup so a script payload in a name stays text', () => {
    expect(xmlText('<img src=x onerror=alert(1)> & "q" \'a\'')).toBe('&lt;img src=x onerror=alert(1)&gt; &amp; &quot;q&quot; &apos;a&apos;');
  });

  it('drops characters XML 1.0 forbids and keeps tab and CR through a parse (W3C XML 1.0 §2.2, §2.11)', () => {
    const text = `a\u0001b\u0008\tc\rd\uFFFEe\uD800f`;
    const doc = xmlParse('t.xml', `<r a="${xmlText(text)}">${xmlText(text)}</r>`);
    expect(doc.documentElement.textContent).toBe('ab\tc\rdef');
    expect(doc.documentElement.getAttribute('a')).toBe('ab\tc\rdef');
  });
});

describe('xmlDecimal', () => {
  it('writes small numbers without an exponent, as xsd:decimal requires, reading back the same value', () => {
    expect(xmlDecimal(-122.4194)).toBe('-122.4194');
    expect(xmlDecimal(1e-7)).toBe('0.0000001');
    expect(Number(xmlDecimal(3.2e-9))).toBe(3.2e-9);
  });
});
