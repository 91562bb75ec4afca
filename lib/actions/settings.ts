'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { createToken, revokeToken } from '@/lib/services/api-tokens';
import { createSite } from '@/lib/services/sites';
import { createUser, updateUser } from '@/lib/services/users';
import { apiTokenInputSchema } from '@/lib/validation/api-token';
import { idSchema } from '@/lib/validation/common';
import { siteInputSchema } from '@/lib/validation/site';
import { userInputSchema, userUpdateSchema } from '@/lib/validation/user';
import { defineAction } from './define-action';

export const createSiteAction = defineAction(
  { name: 'createSite', permission: 'site.manage', input: siteInputSchema },
  async ({ actor, input }) => {
    const site = await createSite(actor, input);
    revalidatePath('/settings/sites');
    return site;
  },
);

export const createUserAction = defineAction(
  { name: 'createUser', permission: 'user.manage', input: userInputSchema },
  async ({ actor, input }) => {
    const user = await createUser(actor, input);
    revalidatePath('/settings/users');
    return user;
  },
);

export const updateUserAction = defineAction(
  { name: 'updateUser', permission: 'user.manage', input: z.object({ userId: idSchema, user: userUpdateSchema }) },
  async ({ actor, input }) => {
    const user = await updateUser(actor, input.userId, input.user);
    revalidatePath('/settings/users');
    return user;
  },
);

export const createApiTokenAction = defineAction(
  { name: 'createApiToken', permission: 'token.manage', input: apiTokenInputSchema },
  async ({ actor, input }) => createToken(actor, input),
);

export const revokeApiTokenAction = defineAction(
  { name: 'revokeApiToken', permission: 'token.manage', input: z.object({ tokenId: idSchema }) },
  async ({ actor, input }) => {
    const token = await revokeToken(actor, input.tokenId);
    revalidatePath('/settings/api-tokens');
    return token;
  },
);
