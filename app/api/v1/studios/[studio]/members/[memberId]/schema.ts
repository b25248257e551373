import { z } from 'zod';
import { roleSchema, studioParams, uuidSchema } from '@/lib/api/schemas';

export const memberParams = studioParams.extend({ memberId: uuidSchema('memberId') });
export const changeRoleBody = z.strictObject({ role: roleSchema });
