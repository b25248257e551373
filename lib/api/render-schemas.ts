import { z } from 'zod';
import { studioParams, uuidSchema } from './schemas';

export const renderParams = studioParams.extend({ renderId: uuidSchema('renderId') });
export const frameParams = renderParams.extend({ index: z.coerce.number({ error: 'index must be a frame number' }).int().min(0, 'frame numbers start at 0') });
export const deliveryParams = studioParams.extend({ deliveryId: uuidSchema('deliveryId') });
