import 'server-only';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import { notFound } from '@/lib/http/errors';
import type { SurveyInput } from '@/lib/validation/survey';
import { Survey } from '@/models';
import { recordAudit } from './audit';
import { surveyDto } from './dto';

export async function listSurveys(siteId: number) {
  return (await Survey.findAll({ where: { siteId }, order: [['startsOn', 'DESC']] })).map(surveyDto);
}

export async function siteIdOfSurvey(surveyId: number): Promise<number | null> {
  return (await Survey.findByPk(surveyId, { attributes: ['siteId'] }))?.siteId ?? null;
}

export async function getSurvey(surveyId: number) {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  return surveyDto(survey);
}

export async function createSurvey(actor: Actor, siteId: number, input: SurveyInput) {
  return writeTransaction(async (transaction) => {
    const survey = await Survey.create({ ...input, siteId }, { transaction });
    await recordAudit(actor, { siteId, action: 'survey.create', entityType: 'survey', entityId: survey.id, after: surveyDto(survey) }, transaction);
    return surveyDto(survey);
  });
}
