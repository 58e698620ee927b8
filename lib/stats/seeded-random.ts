/**
 * mulberry32, a small seeded 32-bit generator (Tommy Ettinger's public-domain mulberry32, as
 * collected in bryc's "PRNGs" notes): uniform numbers in [0, 1) that are the same for the same
 * seed on every machine. For invented data that must come out byte for byte the same on every
 * run (the example files, the demo measurements, the benchmark's inputs); not for anything secret.
 */
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
