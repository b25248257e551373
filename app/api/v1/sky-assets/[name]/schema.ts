import { z } from 'zod';

/** The sky assets a browser may fetch: the star catalogue (SKYSTAR1) and the Milky Way map (SKYMWMP1). */
export const SKY_ASSET_NAMES = ['stars-8', 'milky-way'] as const;

export const skyAssetParams = z.object({
  name: z.enum(SKY_ASSET_NAMES, { error: `name must be one of ${SKY_ASSET_NAMES.join(', ')}` }),
});
