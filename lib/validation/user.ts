import { z } from 'zod';
import { ROLES, USER_STATUSES } from '@/lib/domain/vocabulary';
import { idSchema } from './common';

export const passwordSchema = z.string().min(10, 'A password is at least 10 characters.').max(200);

export const userInputSchema = z.object({
  email: z.string().trim().toLowerCase().email('Not an e-mail address.'),
  name: z.string().trim().min(1, 'A name is required.').max(120),
  role: z.enum(ROLES),
  password: passwordSchema,
  siteIds: z.array(idSchema).default([]),
});
export type UserInput = z.output<typeof userInputSchema>;

export const userUpdateSchema = z.object({
  name: z.string().trim().min(1).max(120).optional(),
  role: z.enum(ROLES).optional(),
  status: z.enum(USER_STATUSES).optional(),
  password: passwordSchema.optional(),
  siteIds: z.array(idSchema).optional(),
});
export type UserUpdate = z.output<typeof userUpdateSchema>;
