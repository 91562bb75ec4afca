'use server';

import { revalidatePath } from 'next/cache';
import { z } from 'zod';
import { createArea, siteIdOfArea, updateArea } from '@/lib/services/areas';
import { createSurvey } from '@/lib/services/surveys';
import { createTrap, siteIdOfTrap, updateTrap } from '@/lib/services/traps';
import { areaInputSchema } from '@/lib/validation/area';
import { idSchema } from '@/lib/validation/common';
import { surveyInputSchema } from '@/lib/validation/survey';
import { trapInputSchema, trapUpdateSchema } from '@/lib/validation/trap';
import { defineAction } from './define-action';

export const createTrapAction = defineAction(
  { name: 'createTrap', permission: 'trap.write', input: z.object({ siteId: idSchema, trap: trapInputSchema }), site: (i) => i.siteId },
  async ({ actor, input }) => createTrap(actor, input.siteId, input.trap),
);

export const updateTrapAction = defineAction(
  { name: 'updateTrap', permission: 'trap.write', input: z.object({ trapId: idSchema, trap: trapUpdateSchema }), site: (i) => siteIdOfTrap(i.trapId) },
  async ({ actor, input }) => updateTrap(actor, input.trapId, input.trap),
);

export const createAreaAction = defineAction(
  { name: 'createArea', permission: 'area.write', input: z.object({ siteId: idSchema, area: areaInputSchema }), site: (i) => i.siteId },
  async ({ actor, input }) => {
    const area = await createArea(actor, input.siteId, input.area);
    revalidatePath(`/sites/${input.siteId}/areas`);
    return area;
  },
);

export const updateAreaAction = defineAction(
  { name: 'updateArea', permission: 'area.write', input: z.object({ areaId: idSchema, area: areaInputSchema }), site: (i) => siteIdOfArea(i.areaId) },
  async ({ actor, input }) => updateArea(actor, input.areaId, input.area),
);

export const createSurveyAction = defineAction(
  { name: 'createSurvey', permission: 'survey.write', input: z.object({ siteId: idSchema, survey: surveyInputSchema }), site: (i) => i.siteId },
  async ({ actor, input }) => createSurvey(actor, input.siteId, input.survey),
);
