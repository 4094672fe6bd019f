/**
 * Seeded pseudo-random numbers for reproducible tests, benchmarks and the demo scenario.
 *
 * mulberry32 (Tommy Ettinger's 32-bit generator, public domain) for uniforms; Box–Muller for normals.
 * Not for cryptography.
 *
 * @example const rng = createRng(42); rng.uniform(); rng.normal(0, 1);
 */
export interface Rng {
  /** Uniform on [0, 1). */
  uniform(): number;
  /** Normal with the given mean and standard deviation. */
  normal(mean?: number, sd?: number): number;
  /** Whole number uniform on [lo, hi]. */
  int(lo: number, hi: number): number;
}

export function createRng(seed: number): Rng {
  let state = seed >>> 0;
  let spare: number | null = null;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const normal = (mean = 0, sd = 1): number => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return mean + sd * z;
    }
    let u = 0;
    while (u === 0) u = uniform();
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return mean + sd * r * Math.cos(2 * Math.PI * v);
  };
  const int = (lo: number, hi: number): number => lo + Math.floor(uniform() * (hi - lo + 1));
  return { uniform, normal, int };
}
