import { z } from 'zod';
import { ROLES } from '../../../lib/permissions';

// The session body the server answers with for sign-in, sign-up and GET /api/session.
const idSchema = z.union([z.string(), z.number()]).transform(String);

export const sessionSchema = z.object({
  user: z.object({ id: idSchema, email: z.string(), name: z.string() }),
  firm: z.object({ id: idSchema, name: z.string() }),
  role: z.enum(ROLES),
});

export type Session = z.output<typeof sessionSchema>;
