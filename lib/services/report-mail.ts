import 'server-only';
import { Op } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import { AppError, notFound } from '@/lib/http/errors';
import { appUrl } from '@/lib/mail/config';
import { reportMail } from '@/lib/mail/messages';
import { sendMail } from '@/lib/mail/transport';
import { money, percent, quantity } from '@/lib/outcomes/format';
import { Site, SiteMembership, Survey, User } from '@/models';
import { recordAudit } from './audit';
import { surveySummary } from './outcomes';

/**
 * E-mails a published survey to the site's viewers: headline figures and links, never the file
 * (access is checked again when the link is opened). Returns who was written to.
 */
export async function emailSurveyReport(actor: Actor, surveyId: number) {
  const survey = await Survey.findByPk(surveyId);
  if (!survey) throw notFound('survey');
  if (survey.status !== 'published') throw new AppError('conflict', 'Only a published survey is sent to its readers: publish it first.');
  const site = (await Site.findByPk(survey.siteId))!;
  const members = await SiteMembership.findAll({ where: { siteId: site.id }, attributes: ['userId'] });
  const viewers = await User.findAll({ where: { id: { [Op.in]: members.map((m) => m.userId) }, role: 'viewer', status: 'active' } });
  if (viewers.length === 0) throw new AppError('conflict', `${site.name} has no active viewer to send the report to.`);
  const { figures, settings } = await surveySummary(surveyId);
  const t = figures.total;
  const base = appUrl();
  const publishedOn = survey.publishedAt ? survey.publishedAt.toISOString().slice(0, 10) : '';
  const results: { email: string; sent: boolean }[] = [];
  for (const viewer of viewers) {
    const sent = await sendMail(reportMail({
      to: viewer.email, name: viewer.name, siteName: site.name, surveyName: survey.name, publishedOn, sentBy: actor.name,
      surveyUrl: `${base}/sites/${site.id}/surveys/${survey.id}`, pdfUrl: `${base}/api/surveys/${survey.id}/report?format=pdf`,
      figures: [
        ['Traps tested', `${t.tested} of ${t.inService} in service`],
        ['Failure rate', percent(t.failureRate)],
        ['Steam lost', quantity(t.lossTonnesPerYear, 'annualMass', site.unitSystem, 0)],
        ['Cost per year', money(t.costPerYear, settings.currency)],
        ['CO2 per year', `${t.co2TonnesPerYear.toFixed(0)} t`],
      ],
    }));
    results.push({ email: viewer.email, sent: sent.sent });
  }
  await writeTransaction((transaction) => recordAudit(actor, {
    siteId: site.id, action: 'survey.report_email', entityType: 'survey', entityId: surveyId, after: { to: results },
  }, transaction));
  return { recipients: results };
}
