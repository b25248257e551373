import { z } from 'zod';
import { ROLES } from '@/lib/auth/roles';

/** Path parameters shared by every studio-scoped route. */
export const studioParams = z.object({ studio: z.string().regex(/^[a-z0-9-]{1,60}$/, 'studio must be a studio slug') });
export const noParams = z.object({});
export const roleSchema = z.enum(ROLES, { error: `role must be one of ${ROLES.join(', ')}` });
export const emailSchema = z.string().trim().toLowerCase().email('email must be an e-mail address like name@example.org').max(320);
export const uuidSchema = (field: string) => z.string().uuid(`${field} must be an id from this studio`);
