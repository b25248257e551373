/**
 * GPU sky data built in a Web Worker (sky-data.worker.ts), so the page stays
 * responsive while the star tiles are built, and kept for the few magnitude
 * limits last used. Falls back to building on this thread where workers are
 * unavailable or the worker fails.
 */
import { loadAndBuildGpuSkyData, type GpuSkyData } from './sky-data';

/** Sky data already built, by asset base and magnitude limit (a few, since each holds ~85 MB of star textures). */
const built = new Map<string, GpuSkyData>();
const BUILT_KEPT = 3;
const keyOf = (base: string, limit: number) => `${base}|${limit}`;

let worker: Worker | null = null;
let nextId = 1;
const pending = new Map<number, { resolve: (data: GpuSkyData) => void; reject: (error: Error) => void }>();

function skyDataWorker(): Worker | null {
  if (worker || typeof Worker === 'undefined') return worker;
  try {
    worker = new Worker(new URL('./sky-data.worker.ts', import.meta.url), { type: 'module' });
  } catch {
    return null;
  }
  worker.onmessage = (event: MessageEvent<{ id: number; data?: GpuSkyData; error?: string }>) => {
    const waiting = pending.get(event.data.id);
    pending.delete(event.data.id);
    if (!waiting) return;
    if (event.data.data) waiting.resolve(event.data.data);
    else waiting.reject(new Error(event.data.error ?? 'the sky data worker failed'));
  };
  worker.onerror = () => {
    // a worker that cannot start (e.g. blocked) fails every request; they fall back to this thread
    for (const waiting of pending.values()) waiting.reject(new Error('the sky data worker could not run'));
    pending.clear();
    worker?.terminate();
    worker = null;
  };
  return worker;
}

/** The sky data of a magnitude limit when it has been built already (no waiting). */
export function cachedGpuSkyData(base: string, limit: number): GpuSkyData | undefined {
  return built.get(keyOf(base, limit));
}

function build(absolute: string, limit: number): Promise<GpuSkyData> {
  const w = skyDataWorker();
  if (!w) return loadAndBuildGpuSkyData(absolute, limit);
  const id = nextId++;
  return new Promise<GpuSkyData>((resolve, reject) => {
    pending.set(id, { resolve, reject });
    w.postMessage({ id, base: absolute, limit });
  }).catch(() => loadAndBuildGpuSkyData(absolute, limit));
}

/**
 * The GPU sky data for a magnitude limit, from the cache or built (and then kept).
 * @param base sky-assets URL (made absolute for the worker)
 * @param limit faintest star magnitude drawn
 */
export async function loadGpuSkyData(base: string, limit: number): Promise<GpuSkyData> {
  const key = keyOf(base, limit);
  const hit = built.get(key);
  if (hit) return hit;
  const data = await build(new URL(base, window.location.href).href, limit);
  if (built.size >= BUILT_KEPT) built.delete(built.keys().next().value!);
  built.set(key, data);
  return data;
}
