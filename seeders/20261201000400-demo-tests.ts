// Real tests in the demo's surveys, made by the real import: the demo register's meter files
// (lib/demo, one seeded generator) are stored as uploaded files and run through
// processUpload, so every test, series, figure and suggested verdict comes from the same code
// as a user's upload. The survey in progress gets its first 40 % of the route; the rest is
// written to a folder when PLUMEWARD_DEMO_DAY_DIR names one (see writeDemoDayFiles).
import { Op } from 'sequelize';
import { profileFingerprint } from '@/lib/import/header-fingerprint';
import { parseInstrumentProfile } from '@/lib/import/instrument-profile';
import { processUpload } from '@/lib/server/process-upload';
import { storeBytes } from '@/lib/server/upload-store';
import { InstrumentProfile, SourceFile, Test, Upload, User } from '@/models';
import modelA from '@/fixtures/meters/model-a/model-a.profile.json';
import modelB from '@/fixtures/meters/model-b/model-b.profile.json';
import { DEMO_USERS } from './demo-scenario';
import { demoSurveys, filesOfSurvey, writeDemoDayFiles } from './demo-meter-files';

export const DEMO_PROFILES = [
  { name: 'Model A', json: modelA },
  { name: 'Model B', json: modelB },
] as const;

const analystEmail = DEMO_USERS.find((u) => u.role === 'analyst')!.email;

/** As the app saves a profile (lib/services/instrument-profiles.ts): the fingerprint of its header, kept in the definition too. */
function profileRow(name: string, json: unknown, createdBy: number) {
  const parsed = parseInstrumentProfile(json);
  if (!parsed.ok) throw new Error(`The fixture profile for ${name} does not parse: ${parsed.issues.join('; ')}`);
  const d = parsed.profile;
  const fingerprint = profileFingerprint(d);
  return { name, fingerprint, definition: { ...d, name, fingerprint }, createdBy };
}

export async function up() {
  const analyst = await User.findOne({ where: { email: analystEmail } });
  if (!analyst) throw new Error(`The demo analyst ${analystEmail} is missing: run the earlier seeders first.`);
  await InstrumentProfile.bulkCreate(DEMO_PROFILES.map((p) => profileRow(p.name, p.json, analyst.id)));
  for (const s of await demoSurveys()) {
    const files = (await filesOfSurvey(s)).filter((f) => f.part === 'imported');
    const upload = await Upload.create({ siteId: s.site.id, surveyId: s.survey.id, createdBy: analyst.id, status: 'queued', filesTotal: files.length });
    const rows = [];
    for (const f of files) {
      rows.push({
        uploadId: upload.id, siteId: s.site.id, surveyId: s.survey.id, containerId: null, name: f.name, entry: null,
        kind: 'file' as const, sha256: await storeBytes(f.bytes), size: f.bytes.length, status: 'pending' as const,
        profileId: null, duplicateOf: null, hints: [],
      });
    }
    await SourceFile.bulkCreate(rows);
    await processUpload(upload.id);
  }
  const dayDir = process.env.PLUMEWARD_DEMO_DAY_DIR;
  if (dayDir) await writeDemoDayFiles(dayDir);
}

export async function down() {
  const analyst = await User.findOne({ where: { email: analystEmail } });
  const surveyIds = (await demoSurveys()).map((s) => s.survey.id);
  if (analyst && surveyIds.length) {
    // The seed's uploads: the demo analyst's into the demo surveys. Stored bytes stay in the
    // store (kept by hash, possibly shared with another upload of the same file).
    const uploads = await Upload.findAll({ where: { createdBy: analyst.id, surveyId: { [Op.in]: surveyIds } }, attributes: ['id'] });
    const uploadIds = uploads.map((u) => u.id);
    await Test.destroy({ where: { uploadId: { [Op.in]: uploadIds } } });
    await SourceFile.destroy({ where: { uploadId: { [Op.in]: uploadIds } } });
    await Upload.destroy({ where: { id: { [Op.in]: uploadIds } } });
  }
  await InstrumentProfile.destroy({ where: { name: { [Op.in]: DEMO_PROFILES.map((p) => p.name) } } });
}
