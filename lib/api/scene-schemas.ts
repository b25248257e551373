import { z } from 'zod';
import { studioParams, uuidSchema } from './schemas';

export const showParams = studioParams.extend({ showId: uuidSchema('showId') });
export const sceneParams = studioParams.extend({ sceneId: uuidSchema('sceneId') });
export const revisionNumber = z.coerce.number({ error: 'revision must be a revision number' }).int('revision must be a whole number').min(1, 'revision numbers start at 1');
export const revisionParams = sceneParams.extend({ number: revisionNumber });
export const nameSchema = z.string().trim().min(1, 'name must not be empty').max(160, 'name must be at most 160 characters');
export const archivedQuery = z.strictObject({ archived: z.enum(['include', 'exclude']).default('exclude') });
export const renameOrArchiveBody = z
  .strictObject({ name: nameSchema.optional(), archived: z.boolean({ error: 'archived must be true or false' }).optional() })
  .refine((b) => b.name !== undefined || b.archived !== undefined, { message: 'send a new name, archived, or both' });
