/**
 * GPU sky data built in a Web Worker (sky-data.worker.ts), so the page stays
 * responsive while the star tiles are built. Falls back to building on this
 * thread where workers are unavailable or the worker fails.
 */
import { buildGpuSkyData, type GpuSkyData } from './sky-data';
import { loadSkyAssets } from '../sky-assets';

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

async function buildHere(base: string, limit: number): Promise<GpuSkyData> {
  const assets = await loadSkyAssets(base);
  return buildGpuSkyData(assets.catalogue, assets.milkyWay, limit);
}

/**
 * The GPU sky data for a magnitude limit.
 * @param base sky-assets URL (made absolute for the worker)
 * @param limit faintest star magnitude drawn
 */
export function loadGpuSkyData(base: string, limit: number): Promise<GpuSkyData> {
  const absolute = new URL(base, window.location.href).href;
  const w = skyDataWorker();
  if (!w) return buildHere(absolute, limit);
  const id = nextId++;
  return new Promise<GpuSkyData>((resolve, reject) => {
    pending.set(id, { resolve, reject });
    w.postMessage({ id, base: absolute, limit });
  }).catch(() => buildHere(absolute, limit));
}
