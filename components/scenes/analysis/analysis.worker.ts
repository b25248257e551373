/// <reference lib="webworker" />
/**
 * Samples the whole shot off the main thread so typing and scrubbing never
 * wait for the charts. Messages: { id, spec } in, { id, points } or { id, error } out.
 */
import type { SceneSpec } from '@/lib/scenes/schema';
import { sceneWorldline } from '@/lib/scenes/readout';
import { sceneTiming } from '@/lib/scenes/frame-request';
import { sampleTimeline } from './timeline';

const SAMPLES = 160;

self.onmessage = (event: MessageEvent<{ id: number; spec: SceneSpec }>) => {
  const { id, spec } = event.data;
  try {
    const worldline = sceneWorldline(spec);
    const points = sampleTimeline(spec, worldline, sceneTiming(spec, worldline), SAMPLES);
    (self as unknown as Worker).postMessage({ id, points });
  } catch (error) {
    (self as unknown as Worker).postMessage({ id, error: error instanceof Error ? error.message : String(error) });
  }
};
