// The owner adds people to the business and sets their role.
import { z } from 'zod';
import { USER_ROLES } from '../words';

// better-auth's minimum (lib/auth.ts: minPasswordLength).
export const MIN_PASSWORD_LENGTH = 10;

export const newPersonInput = z.object({
  name: z.string().trim().min(1, 'needs a name').max(120),
  email: z.string().trim().toLowerCase().pipe(z.email('is not an e-mail address')),
  role: z.enum(USER_ROLES),
  password: z.string().min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`).max(128),
});

export const roleChangeInput = z.object({ role: z.enum(USER_ROLES) });

export type NewPersonInput = z.output<typeof newPersonInput>;
