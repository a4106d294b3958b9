/**
 * A seeded pseudo-random generator (mulberry32, public domain, by Tommy Ettinger): the invented demo region
 * is the same on every machine, and the bootstrap of the Look-back scores is reproducible. Hand-written
 * because it is eight lines and neither may depend on a package's sequence changing between versions.
 */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
