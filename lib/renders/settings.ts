import { z } from 'zod';

/** What a producer asks for when requesting a render (stored on the RenderJob). */
export const renderSettingsSchema = z.strictObject({
  width: z.number().int('width must be a whole number of pixels').min(16, 'width must be at least 16 pixels'),
  height: z.number().int('height must be a whole number of pixels').min(16, 'height must be at least 16 pixels'),
  format: z.enum(['png8', 'png16', 'jpeg'], { error: 'format must be png8, png16 or jpeg' }).default('png8'),
  supersampling: z.number().int().min(1, 'supersampling must be 1 to 4').max(4, 'supersampling must be 1 to 4').default(1),
});
export type RenderSettings = z.output<typeof renderSettingsSchema>;

/** Readouts stored with each frame (SI for the scene's mass) and copied into the manifest. */
export type FrameReadout = {
  properTimeM: number;
  properTimeSeconds: number;
  radiusRs: number;
  radiusKm: number;
  speedRelativeToHover: number | null;
  shiftMin: number | null;
  shiftMax: number | null;
  countdownSeconds: number | null;
  exposureEv: number;
};

/** File name of a frame inside a delivery: <scene-slug>_<frame 0000>.png (product.md, Delivery formats). */
export function frameFileName(sceneSlug: string, index: number, format: RenderSettings['format']): string {
  return `${sceneSlug}_${String(index).padStart(4, '0')}.${format === 'jpeg' ? 'jpg' : 'png'}`;
}
