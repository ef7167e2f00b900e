// A small seeded random source (mulberry32), so a failing fuzz run is replayed from its seed.
export type Random = {
  next(): number;
  int(min: number, max: number): number;
  pick<T>(list: readonly T[]): T;
  chance(p: number): boolean;
  uuid(): string;
  shuffle<T>(list: readonly T[]): T[];
};

export function seededRandom(seed: number): Random {
  let a = seed >>> 0;
  const next = () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const int = (min: number, max: number) => min + Math.floor(next() * (max - min + 1));
  const hex = (n: number) => Array.from({ length: n }, () => int(0, 15).toString(16)).join('');
  return {
    next,
    int,
    pick: (list) => list[int(0, list.length - 1)]!,
    chance: (p) => next() < p,
    // Version-4 layout so zod's uuid check accepts it.
    uuid: () => `${hex(8)}-${hex(4)}-4${hex(3)}-${['8', '9', 'a', 'b'][int(0, 3)]}${hex(3)}-${hex(12)}`,
    shuffle: (list) => {
      const copy = [...list];
      for (let i = copy.length - 1; i > 0; i--) {
        const j = int(0, i);
        [copy[i], copy[j]] = [copy[j]!, copy[i]!];
      }
      return copy;
    },
  };
}
