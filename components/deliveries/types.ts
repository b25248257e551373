/** Shapes of the deliveries API's JSON answers (lib/renders/deliveries.ts, lib/renders/manifest.ts). */
import type { DeliveryManifest } from '@/lib/renders/manifest';

export type DeliverySummary = {
  id: string;
  renderId: string;
  scene: string;
  show: string;
  revision: number;
  approved: boolean;
  frames: number;
  frameRate: number;
  resolution: string;
  projection: string;
  photosensitivity: string;
  status: 'ready' | 'loaded';
  loadedAt: string | null;
  createdAt: string;
};

export type DeliveryDetail = { delivery: DeliverySummary; manifest: DeliveryManifest };

export type ManifestFrame = DeliveryManifest['frames'][number];

export const deliveriesKey = (studio: string) => ['studio', studio, 'deliveries'] as const;

/** The streamed zip of a delivery (frames, manifest.json, photosensitivity report). */
export function downloadUrl(studio: string, deliveryId: string): string {
  return `/api/v1/studios/${studio}/deliveries/${deliveryId}/download`;
}
