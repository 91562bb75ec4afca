import 'server-only';
import { UniqueConstraintError } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { writeTransaction } from '@/lib/db';
import type { InstrumentProfile as ProfileDefinition } from '@/lib/import/instrument-profile';
import { profileFingerprint } from '@/lib/import/header-fingerprint';
import { AppError, notFound } from '@/lib/http/errors';
import { InstrumentProfile, User } from '@/models';
import { changedFields, recordAudit } from './audit';

type ProfileInput = { name: string; fingerprint?: string; definition: ProfileDefinition };

/** The fingerprint a profile recognises files by: as given, else the definition's, else computed from its layout. */
function withFingerprint(definition: ProfileDefinition, given?: string) {
  const fingerprint = given ?? profileFingerprint(definition);
  return { fingerprint, definition: { ...definition, fingerprint } };
}

function profileDto(p: InstrumentProfile & { creator?: User | null }) {
  return {
    id: p.id, name: p.name, fingerprint: p.fingerprint, revision: p.revision, definition: p.definition,
    createdBy: p.creator?.name ?? null, updatedAt: p.updatedAt.toISOString(),
  };
}
export type ProfileDto = ReturnType<typeof profileDto>;

const withCreator = [{ model: User, as: 'creator', attributes: ['name'] }];

export async function listProfiles() {
  return (await InstrumentProfile.findAll({ include: withCreator, order: [['name', 'ASC']] })).map(profileDto);
}

export async function getProfile(profileId: number) {
  const profile = await InstrumentProfile.findByPk(profileId, { include: withCreator });
  if (!profile) throw notFound('instrument profile');
  return profileDto(profile);
}

/** The profile that reads a layout, by its header fingerprint (the newest if several were saved). */
export async function profileForFingerprint(fingerprint: string) {
  return InstrumentProfile.findOne({ where: { fingerprint }, order: [['updatedAt', 'DESC']] });
}

const nameTaken = (err: unknown): never => {
  if (err instanceof UniqueConstraintError) {
    throw new AppError('conflict', 'A profile of that name exists already.', [{ path: 'name', message: 'Already in use.' }]);
  }
  throw err;
};

export async function createProfile(actor: Actor, input: ProfileInput) {
  const id = await writeTransaction(async (transaction) => {
    const profile = await InstrumentProfile.create(
      { name: input.name, ...withFingerprint(input.definition, input.fingerprint), createdBy: actor.userId },
      { transaction },
    ).catch(nameTaken);
    await recordAudit(actor, { siteId: null, action: 'profile.create', entityType: 'instrument_profile', entityId: profile.id, after: { name: input.name, fingerprint: profile.fingerprint } }, transaction);
    return profile.id;
  });
  return getProfile(id);
}

/** Edits move the revision; files already read keep the revision they were read with. */
export async function updateProfile(actor: Actor, profileId: number, input: Partial<ProfileInput>) {
  await writeTransaction(async (transaction) => {
    const profile = await InstrumentProfile.findByPk(profileId, { transaction });
    if (!profile) throw notFound('instrument profile');
    const next = {
      name: input.name ?? profile.name,
      ...(input.definition || input.fingerprint
        ? withFingerprint(input.definition ?? profile.definition, input.fingerprint ?? (input.definition ? undefined : profile.fingerprint))
        : {}),
    };
    const diff = changedFields({ name: profile.name, fingerprint: profile.fingerprint, definition: profile.definition }, next);
    if (!diff.changed) return;
    await profile.update({ ...next, revision: profile.revision + 1 }, { transaction }).catch(nameTaken);
    await recordAudit(actor, { siteId: null, action: 'profile.update', entityType: 'instrument_profile', entityId: profileId, ...diff }, transaction);
  });
  return getProfile(profileId);
}
