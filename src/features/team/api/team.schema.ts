import { z } from 'zod';
import { ROLES } from '../../../lib/permissions';

export const teamMemberSchema = z.object({
  userId: z.string(),
  name: z.string(),
  email: z.string(),
  role: z.enum(ROLES),
  joinedAt: z.string(),
});

export type TeamMember = z.output<typeof teamMemberSchema>;
