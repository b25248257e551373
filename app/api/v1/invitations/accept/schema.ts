import { z } from 'zod';

export const acceptBody = z.strictObject({
  token: z.string().min(20, 'token is missing or incomplete: open the link from the e-mail again').max(200),
  name: z.string().trim().min(1, 'Enter your name.').max(120, 'name must be at most 120 characters').optional(),
  password: z.string().max(200, 'password must be at most 200 characters').optional(),
});
