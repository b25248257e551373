import { z } from 'zod';
import { studioParams, uuidSchema } from './schemas';

export const reviewParams = studioParams.extend({ reviewId: uuidSchema('reviewId') });
export const noteParams = reviewParams.extend({ noteId: uuidSchema('noteId') });
export const submitReviewBody = z.strictObject({
  sceneId: uuidSchema('sceneId'),
  revision: z.number().int().min(1, 'revision must be a revision number'),
  advisorIds: z.array(uuidSchema('advisorIds[]')).max(50).optional(),
  message: z.string().trim().max(2000, 'message must be at most 2000 characters').optional(),
});
export const noteBody = z.strictObject({
  body: z.string().trim().min(1, 'write the note').max(5000, 'a note is at most 5000 characters'),
  tau: z.number().finite().min(0, 'tau must be zero or more (proper time in M)').optional(),
  point: z.strictObject({ x: z.number().min(0).max(1, 'point.x is 0..1 across the frame'), y: z.number().min(0).max(1, 'point.y is 0..1 down the frame') }).optional(),
  parentId: uuidSchema('parentId').optional(),
});
export const noteStatusBody = z.strictObject({ status: z.enum(['open', 'resolved', 'accepted'], { error: 'status must be open, resolved or accepted' }) });
export const changesBody = z.strictObject({ message: z.string().trim().min(1, 'say what should change').max(5000) });
