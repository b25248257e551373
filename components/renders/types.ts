/**
 * Shapes of the render API's JSON answers as the browser sees them
 * (lib/renders/views.ts and service.ts build them on the server).
 */
import type { FrameReadout, RenderSettings } from '@/lib/renders/settings';

export type RenderStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

export type RenderSummary = {
  id: string;
  sceneId: string;
  sceneName: string;
  revision: number;
  kind: 'still' | 'sequence';
  status: RenderStatus;
  frameStart: number;
  frameCount: number;
  framesDone: number;
  framesFailed: number;
  draft: boolean;
  settings: RenderSettings;
  error: string | null;
  photosensitivity: PhotosensitivityResult | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
};

export type FailingRange = { startFrame: number; endFrame: number; startSeconds: number; endSeconds: number; count: number };

/** The stored check: a full report for sequences, or `not-applicable` for a still. */
export type PhotosensitivityResult = {
  verdict: 'pass' | 'fail' | 'not-applicable' | string;
  summary?: string;
  generalFlashes?: { maxPerSecond: number; failingRanges: FailingRange[] };
  redFlashes?: { maxPerSecond: number; failingRanges: FailingRange[] };
};

export type StoredFrame = { index: number; sha256: string; bytes: number; readout: FrameReadout; renderMs: number; worker: string };

export type RenderDetail = {
  render: RenderSummary;
  contentHash: string;
  frames: StoredFrame[];
  framesPerMinute: number | null;
  secondsLeft: number | null;
  meanRenderMs: number | null;
  delivery: { id: string; status: string } | null;
};

/** Statuses in which workers are still busy: pages keep polling while a render is in one of these. */
export const ACTIVE_STATUSES: readonly RenderStatus[] = ['queued', 'running'];

export function isActive(status: RenderStatus): boolean {
  return ACTIVE_STATUSES.includes(status);
}

/** URL of one stored frame; `thumb` asks the server for a 256-pixel JPEG preview. */
export function frameUrl(studio: string, renderId: string, index: number, size: 'full' | 'thumb' = 'full'): string {
  return `/api/v1/studios/${studio}/renders/${renderId}/frames/${index}${size === 'thumb' ? '?size=thumb' : ''}`;
}
