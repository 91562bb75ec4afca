import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { Op, UniqueConstraintError } from 'sequelize';
import type { InvitationInput } from '@/lib/api/work-order-routes';
import type { Actor } from '@/lib/auth/actor';
import { hashPassword } from '@/lib/auth/sign-in';
import { writeTransaction } from '@/lib/db';
import { ROLE_LABELS } from '@/lib/domain/vocabulary';
import { AppError } from '@/lib/http/errors';
import { appUrl } from '@/lib/mail/config';
import { invitationMail } from '@/lib/mail/messages';
import { sendMail } from '@/lib/mail/transport';
import { Invitation, Site, SiteMembership, User } from '@/models';
import { recordAudit } from './audit';

// An admin invites a user by e-mail instead of handing out a password. The link carries a random
// token of 32 bytes; only its SHA-256 is stored, so the table alone cannot be used to sign up.
// A link works once and expires after PLUMEWARD_INVITATION_HOURS (default 72).

export const invitationHours = () => Number(process.env.PLUMEWARD_INVITATION_HOURS ?? 72) || 72;
const hashOf = (token: string) => createHash('sha256').update(token).digest('hex');

export type InvitationState = 'pending' | 'accepted' | 'expired' | 'revoked';

function stateOf(i: Invitation, now = new Date()): InvitationState {
  if (i.acceptedAt) return 'accepted';
  if (i.revokedAt) return 'revoked';
  if (i.expiresAt <= now) return 'expired';
  return 'pending';
}

const dto = (i: Invitation) => ({
  id: i.id, email: i.email, name: i.name, role: i.role, siteIds: i.siteIds ?? [], expiresAt: i.expiresAt.toISOString(),
  state: stateOf(i), createdAt: i.createdAt.toISOString(),
});

export async function listInvitations() {
  return { items: (await Invitation.findAll({ order: [['createdAt', 'DESC'], ['id', 'DESC']], limit: 200 })).map(dto) };
}

export async function createInvitation(actor: Actor, input: InvitationInput) {
  if (await User.findOne({ where: { email: input.email }, attributes: ['id'] })) {
    throw new AppError('conflict', 'A user with this e-mail already exists.', [{ path: 'email', message: 'Already a user.' }]);
  }
  const siteIds = input.role === 'admin' ? [] : [...new Set(input.siteIds)];
  const sites = await Site.findAll({ where: { id: { [Op.in]: siteIds } }, attributes: ['id', 'name'] });
  if (sites.length !== siteIds.length) throw new AppError('invalid', 'Invalid request body.', [{ path: 'siteIds', message: 'One of these sites does not exist.' }]);
  const token = randomBytes(32).toString('base64url');
  const expiresAt = new Date(Date.now() + invitationHours() * 3_600_000);
  const invitation = await writeTransaction(async (transaction) => {
    // A new invitation replaces any earlier one to the same address that is still open.
    await Invitation.update({ revokedAt: new Date() }, { where: { email: input.email, acceptedAt: null, revokedAt: null }, transaction });
    const made = await Invitation.create({
      email: input.email, name: input.name, role: input.role, siteIds, tokenHash: hashOf(token), expiresAt,
      acceptedAt: null, revokedAt: null, createdBy: actor.userId,
    }, { transaction });
    await recordAudit(actor, { siteId: null, action: 'invitation.create', entityType: 'invitation', entityId: made.id, after: { email: input.email, role: input.role, siteIds, expiresAt: expiresAt.toISOString() } }, transaction);
    return made;
  });
  const result = await sendMail(invitationMail({
    to: input.email, name: input.name, roleLabel: ROLE_LABELS[input.role], siteNames: sites.map((s) => s.name),
    invitedBy: actor.name, url: `${appUrl()}/invitations/${token}`, expiresAt,
  }));
  return { ...dto(invitation), mailed: result.sent };
}

/** What the invitation page shows for a token: whether it can still be used, and for whom. */
export async function invitationForToken(token: string): Promise<{ state: InvitationState | 'unknown'; name?: string; email?: string; role?: string; expiresAt?: string }> {
  const invitation = token.length >= 20 ? await Invitation.findOne({ where: { tokenHash: hashOf(token) } }) : null;
  if (!invitation) return { state: 'unknown' };
  return { state: stateOf(invitation), name: invitation.name, email: invitation.email, role: ROLE_LABELS[invitation.role], expiresAt: invitation.expiresAt.toISOString() };
}

const REFUSED: Record<Exclude<InvitationState, 'pending'> | 'unknown', string> = {
  accepted: 'This invitation has already been used. Sign in with the password chosen then, or ask an admin for a new invitation.',
  expired: 'This invitation has expired. Ask an admin to send a new one.',
  revoked: 'This invitation was replaced by a newer one. Use the link in the latest e-mail, or ask an admin.',
  unknown: 'This invitation link is not valid. Check that the whole link was copied, or ask an admin for a new one.',
};

/** Uses an invitation once: creates the user with the chosen password and their sites. */
export async function acceptInvitation(token: string, password: string) {
  const passwordHash = await hashPassword(password);
  return writeTransaction(async (transaction) => {
    // Locked on PostgreSQL, where two instances may take the same link at once; the second then sees it used.
    const invitation = await Invitation.findOne({ where: { tokenHash: hashOf(token) }, transaction, lock: true });
    const state = invitation ? stateOf(invitation) : 'unknown';
    if (state !== 'pending') throw new AppError(state === 'unknown' ? 'not_found' : 'conflict', REFUSED[state]);
    const user = await User.create({ email: invitation!.email, name: invitation!.name, role: invitation!.role, passwordHash }, { transaction }).catch((err) => {
      if (err instanceof UniqueConstraintError) throw new AppError('conflict', 'A user with this e-mail already exists: sign in instead.');
      throw err;
    });
    const siteIds = invitation!.siteIds ?? [];
    if (siteIds.length) await SiteMembership.bulkCreate(siteIds.map((siteId) => ({ userId: user.id, siteId })), { transaction });
    await invitation!.update({ acceptedAt: new Date() }, { transaction });
    await recordAudit(null, { siteId: null, action: 'invitation.accept', entityType: 'invitation', entityId: invitation!.id, after: { userId: user.id, email: user.email, role: user.role, siteIds } }, transaction);
    return { email: user.email };
  });
}
