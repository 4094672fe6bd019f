import type { Highs } from 'highs';

/**
 * Loads the HiGHS WebAssembly solver (npm `highs`) by dynamic import, so bundles and modules that never solve a
 * MILP do not load it. Pass loader options such as `locateFile` in a browser. The one place the optimizer loads it.
 *
 * Cost: one module load and Wasm compile (tens of milliseconds). Throws when the package cannot be loaded.
 *
 * @example const highs = await loadHighs(); highs.solve('Minimize\n obj: x\nBounds\n x >= 1\nEnd')
 */
export async function loadHighs(loaderOptions: Record<string, unknown> = {}): Promise<Highs> {
  const module = await import('highs');
  return module.default(loaderOptions);
}
