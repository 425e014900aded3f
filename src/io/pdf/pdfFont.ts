import type { jsPDF } from 'jspdf';
import { DEJAVU_SANS_CONDENSED_BASE64 } from './fonts/dejavuSansCondensedBase64';

/** Family name the embedded font is registered under in every stratplot PDF. */
export const PDF_FONT_FAMILY = 'StratplotSans';

/** Base64 of bytes without Buffer (runs in browsers and workers too). */
export function bytesToBase64(bytes: Uint8Array): string {
  let binary = '';
  const CHUNK = 0x8000;
  for (let i = 0; i < bytes.length; i += CHUNK) {
    binary += String.fromCharCode(...bytes.subarray(i, i + CHUNK));
  }
  return btoa(binary);
}

/**
 * Embeds a TrueType font in a jsPDF document and makes it current, so names in any script the font
 * covers (Latin with macrons, Greek, Cyrillic... — DejaVu Sans Condensed by default; it has no CJK)
 * print and stay extractable as text. The one face is registered as normal and bold (tables ask
 * for bold headers); emphasis in our layouts comes from size and rules instead.
 * @param fontBytes a TTF to use instead of the bundled DejaVu Sans Condensed.
 * @returns the family name to pass to `doc.setFont`.
 * A font jsPDF cannot parse fails on first use with jsPDF's own error (fonts are ours or the caller's, not user input).
 */
export function pdfFontRegister(doc: jsPDF, fontBytes?: Uint8Array): string {
  const base64 = fontBytes ? bytesToBase64(fontBytes) : DEJAVU_SANS_CONDENSED_BASE64;
  const file = `${PDF_FONT_FAMILY}.ttf`;
  doc.addFileToVFS(file, base64);
  doc.addFont(file, PDF_FONT_FAMILY, 'normal');
  doc.addFont(file, PDF_FONT_FAMILY, 'bold');
  doc.setFont(PDF_FONT_FAMILY, 'normal');
  return PDF_FONT_FAMILY;
}
