// A small seeded generator: a string hash feeds a 128-bit-state generator (sfc32). The same seed gives the
// same sequence on every machine, because only 32-bit integer arithmetic is used.

/** Four 32-bit words from a string (two FNV-1a style passes with different offsets, then mixing). */
export function hashString(s: string): [number, number, number, number] {
  let h1 = 0x811c9dc5, h2 = 0x01000193 ^ 0x9e3779b9, h3 = 0x27d4eb2f, h4 = 0x165667b1;
  for (let i = 0; i < s.length; i++) {
    const c = s.charCodeAt(i);
    h1 = Math.imul(h1 ^ c, 0x01000193);
    h2 = Math.imul(h2 ^ c, 0x5bd1e995);
    h3 = Math.imul(h3 ^ c, 0x85ebca6b);
    h4 = Math.imul(h4 ^ c, 0xc2b2ae35);
  }
  const mix = (h: number) => {
    h ^= h >>> 16;
    h = Math.imul(h, 0x7feb352d);
    h ^= h >>> 15;
    h = Math.imul(h, 0x846ca68b);
    h ^= h >>> 16;
    return h >>> 0;
  };
  return [mix(h1 ^ s.length), mix(h2), mix(h3 + 1), mix(h4 + 2)];
}

/** A generator of floats in [0, 1) seeded from a string. */
export function seededRandom(seed: string): () => number {
  let [a, b, c, d] = hashString(seed);
  const next = () => {
    a >>>= 0; b >>>= 0; c >>>= 0; d >>>= 0;
    const t = (a + b + d) >>> 0;
    d = (d + 1) >>> 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) >>> 0;
    c = (c << 21) | (c >>> 11);
    c = (c + t) >>> 0;
    return t / 4294967296;
  };
  for (let i = 0; i < 12; i++) next(); // warm up
  return next;
}
