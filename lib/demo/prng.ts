// A small seeded generator for the demo data: the same seed gives the same numbers on every
// machine, so a fresh demo always has the same surveys. Never Math.random.

/** mulberry32: a 32-bit state generator, uniform on [0, 1). Public domain (Tommy Ettinger). */
export function mulberry32(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** FNV-1a over a string: a stable seed per trap tag, so one trap's story does not move when another's does. */
export function hashSeed(text: string, salt = 0): number {
  let h = (0x811c9dc5 ^ salt) >>> 0;
  for (let i = 0; i < text.length; i++) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}

export interface Rng {
  next(): number;
  /** Uniform on [min, max). */
  between(min: number, max: number): number;
  /** Integer on [min, max]. */
  int(min: number, max: number): number;
  /** True with probability p. */
  chance(p: number): boolean;
  pick<T>(items: readonly T[]): T;
  /** One of the weighted choices; weights need not sum to 1. */
  weighted<T>(choices: readonly (readonly [T, number])[]): T;
  /** Uniform noise on (−amp, amp). */
  noise(amp: number): number;
}

export function createRng(seed: number): Rng {
  const next = mulberry32(seed);
  const rng: Rng = {
    next,
    between: (min, max) => min + (max - min) * next(),
    int: (min, max) => min + Math.floor((max - min + 1) * next()),
    chance: (p) => next() < p,
    pick: (items) => items[Math.floor(next() * items.length)],
    weighted: (choices) => {
      const total = choices.reduce((s, [, w]) => s + w, 0);
      let x = next() * total;
      for (const [value, w] of choices) {
        x -= w;
        if (x < 0) return value;
      }
      return choices[choices.length - 1][0];
    },
    noise: (amp) => (next() * 2 - 1) * amp,
  };
  return rng;
}
