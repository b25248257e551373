/**
 * File locations for the Node-side renderer (Node only: uses node:path and the
 * package resolver). Sky sources come from the installed d3-celestial package;
 * converted forms are cached under <repo>/.data/cache (git-ignored), so a fresh
 * clone needs no manual build step.
 */
import path from 'node:path';
import { createRequire } from 'node:module';

const requireHere = createRequire(path.join(process.cwd(), 'package.json'));

/** Directory of d3-celestial's data files (stars.8.json, mw.json). */
export function celestialDataDir(): string {
  return path.join(path.dirname(requireHere.resolve('d3-celestial/package.json')), 'data');
}

/** Cache directory for converted sky data: <repo>/.data/cache, the repo being the one that installed d3-celestial. */
export function renderCacheDir(): string {
  const pkgDir = path.dirname(requireHere.resolve('d3-celestial/package.json'));
  return path.join(pkgDir, '..', '..', '.data', 'cache');
}

/** The worker-thread entry file of the render pool (TypeScript). */
export function renderWorkerFile(): string {
  return path.join(__dirname, 'worker.ts');
}

/** The worker threads' main module: a CommonJS file that loads renderWorkerFile() through tsx. */
export function renderWorkerBootstrapFile(): string {
  return path.join(__dirname, 'workerBootstrap.cjs');
}
