import { z } from 'zod';
import { emailSchema, roleSchema } from '@/lib/api/schemas';

export const inviteBody = z.strictObject({ email: emailSchema, role: roleSchema });
export type InviteBody = z.infer<typeof inviteBody>;
