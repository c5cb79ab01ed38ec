/**
 * A small seeded generator (mulberry32) so every big database is the same
 * from one run to the next: figures compare across runs and branches.
 */
export class Rng {
  private state: number;

  constructor(seed: number) {
    this.state = seed >>> 0;
  }

  /** A float in [0, 1). */
  next(): number {
    this.state = (this.state + 0x6d2b79f5) >>> 0;
    let t = this.state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4_294_967_296;
  }

  /** An integer in [min, max]. */
  int(min: number, max: number): number {
    return min + Math.floor(this.next() * (max - min + 1));
  }

  chance(p: number): boolean {
    return this.next() < p;
  }

  pick<T>(items: readonly T[]): T {
    const item = items[Math.floor(this.next() * items.length)];
    if (item === undefined) throw new Error("pick from an empty list");
    return item;
  }

  /** k distinct items (k ≤ items.length), in random order. */
  sample<T>(items: readonly T[], k: number): T[] {
    const copy = [...items];
    for (let i = 0; i < k; i++) {
      const j = i + Math.floor(this.next() * (copy.length - i));
      [copy[i], copy[j]] = [copy[j]!, copy[i]!];
    }
    return copy.slice(0, k);
  }
}

/** Splits `total` into `parts` positive integers with uneven (random) weights. */
export function unevenSplit(rng: Rng, total: number, parts: number, min = 1): number[] {
  const weights = Array.from({ length: parts }, () => 0.25 + rng.next() ** 2 * 3);
  const sum = weights.reduce((a, b) => a + b, 0);
  const spare = total - min * parts;
  if (spare < 0) throw new Error(`cannot split ${total} into ${parts} parts of at least ${min}`);
  const out = weights.map((w) => min + Math.floor((w / sum) * spare));
  let left = total - out.reduce((a, b) => a + b, 0);
  for (let i = 0; left > 0; i = (i + 1) % parts, left--) out[i]! += 1;
  return out;
}
