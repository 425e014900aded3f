const LETTERS = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ';

/**
 * A three-character upper-case code for a stratum key, not in `taken`: initials of the first
 * three words, or the first two letters of the first word and the first of the second, or the
 * first three letters of a single word, padded with X. Accents are dropped ("Érable" → "ERA").
 * On a clash the last character is replaced by 2–9, then A–Z, then two-digit numbers are used.
 * Common practice, no source.
 */
export function stratumCodeDerive(key: string, taken: ReadonlySet<string>): string {
  const plain = key.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').toUpperCase();
  const words = plain.split(/[^A-Z0-9]+/).filter((w) => w.length > 0);
  let base: string;
  if (words.length >= 3) base = words[0][0] + words[1][0] + words[2][0];
  else if (words.length === 2) base = words[0].slice(0, 2) + words[1][0];
  else if (words.length === 1) base = words[0].slice(0, 3);
  else base = 'STR';
  base = base.padEnd(3, 'X').slice(0, 3);
  if (!taken.has(base)) return base;
  for (const c of `23456789${LETTERS}`) {
    const candidate = base.slice(0, 2) + c;
    if (!taken.has(candidate)) return candidate;
  }
  for (let n = 10; ; n++) {
    const candidate = base[0] + String(n);
    if (!taken.has(candidate)) return candidate;
  }
}
