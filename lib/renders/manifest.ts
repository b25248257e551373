import type { FrameReadout, RenderSettings } from './settings';

/** manifest.json of a delivery (product.md, Delivery formats): everything a venue's playback system and an advisor need. */
export type DeliveryManifest = {
  format: 'skywell-delivery/1';
  scene: { name: string; slug: string; show: string };
  revision: { number: number; contentHash: string; approved: boolean };
  massSolar: number;
  frameRate: number;
  resolution: { width: number; height: number };
  projection: Record<string, unknown>;
  exposure: { ev: number; toneMap: string };
  output: RenderSettings['format'];
  frames: Array<FrameReadout & { index: number; file: string; sha256: string; bytes: number }>;
  photosensitivity: unknown;
  nonPhysicalChoices: string[];
  createdAt: string;
};
