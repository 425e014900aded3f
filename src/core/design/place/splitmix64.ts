const MASK_64 = (1n << 64n) - 1n;
const GOLDEN_GAMMA = 0x9e3779b97f4a7c15n;

/** The value's low 64 bits as an unsigned integer (negative values wrap, as in two's complement). */
export function uint64Of(v: bigint): bigint {
  return v & MASK_64;
}

/**
 * splitmix64's output function: a bijective avalanche mix of 64 bits (every input bit changes about
 * half the output bits). Source: Steele, Lea & Flood, "Fast splittable pseudorandom number
 * generators", OOPSLA 2014 (the "mix64" variant 13 of Stafford's mixers, as in Java's SplittableRandom
 * and Vigna's splitmix64.c).
 */
export function splitmix64Mix(z: bigint): bigint {
  z = uint64Of(z);
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK_64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK_64;
  return z ^ (z >> 31n);
}

/**
 * A splitmix64 generator from a 64-bit state: each call adds the golden gamma 0x9e3779b97f4a7c15 to
 * the state and returns the mix of it, as unsigned 64-bit BigInts. Used to expand a short seed into
 * a full generator state (Vigna's advice for seeding xoroshiro128+), not for bulk draws.
 * Source: Steele, Lea & Flood 2014 (above); the Rosetta Code task "Pseudo-random numbers/Splitmix64"
 * lists the first outputs for state 1234567.
 */
export function splitmix64(state: bigint): () => bigint {
  let s = uint64Of(state);
  return () => {
    s = (s + GOLDEN_GAMMA) & MASK_64;
    return splitmix64Mix(s);
  };
}

/** FNV-1a, 64-bit, of a string's UTF-16 code units: turns a stream's name into a 64-bit key (Fowler, Noll & Vo; offset 0xcbf29ce484222325, prime 0x100000001b3). */
export function fnv1a64(text: string): bigint {
  let h = 0xcbf29ce484222325n;
  for (let i = 0; i < text.length; i++) {
    h ^= BigInt(text.charCodeAt(i));
    h = (h * 0x100000001b3n) & MASK_64;
  }
  return h;
}
