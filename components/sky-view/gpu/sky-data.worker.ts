/**
 * Builds the GPU sky data (star tile lists, diffuse map, colour table) off the
 * page's main thread: the star tiles alone take ~1 s, which would freeze typing.
 * Request: { id, base (absolute sky-assets URL), limit (magnitude) };
 * reply: { id, data } with the typed arrays transferred, or { id, error }.
 */
import { loadAndBuildGpuSkyData } from './sky-data';
import { transferablesOf } from './transferables';

self.onmessage = async (event: MessageEvent<{ id: number; base: string; limit: number }>) => {
  const { id, base, limit } = event.data;
  try {
    const data = await loadAndBuildGpuSkyData(base, limit);
    (self as unknown as Worker).postMessage({ id, data }, transferablesOf(data));
  } catch (error) {
    (self as unknown as Worker).postMessage({ id, error: error instanceof Error ? error.message : String(error) });
  }
};
