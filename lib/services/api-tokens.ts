import 'server-only';
import { Op } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { siteIdsOf } from '@/lib/auth/current-user';
import { displayPrefix, hashToken, newTokenSecret } from '@/lib/auth/tokens';
import { writeTransaction } from '@/lib/db';
import { AppError, notFound } from '@/lib/http/errors';
import type { ApiTokenInput } from '@/lib/validation/api-token';
import { ApiToken, User } from '@/models';
import { recordAudit } from './audit';

function tokenDto(token: ApiToken & { user?: User }) {
  return {
    id: token.id, userId: token.userId, userName: token.user?.name ?? null, name: token.name, prefix: token.prefix,
    readOnly: token.readOnly, siteIds: token.siteIds ?? null,
    lastUsedAt: token.lastUsedAt?.toISOString() ?? null, revokedAt: token.revokedAt?.toISOString() ?? null,
    createdAt: token.createdAt.toISOString(),
  };
}
export type ApiTokenDto = ReturnType<typeof tokenDto>;

export async function listTokens() {
  const tokens = await ApiToken.findAll({ include: [{ model: User, as: 'user', attributes: ['name'] }], order: [['createdAt', 'DESC']] });
  return tokens.map(tokenDto);
}

/** Creates a token and returns its secret, which is shown once and never stored. */
export async function createToken(actor: Actor, input: ApiTokenInput) {
  const owner = await User.findByPk(input.userId);
  if (!owner) throw new AppError('invalid', 'Invalid request body.', [{ path: 'userId', message: 'No such user.' }]);
  if (input.siteIds) {
    const ownerSites = await siteIdsOf(owner);
    const outside = ownerSites === 'all' ? [] : input.siteIds.filter((id) => !ownerSites.includes(id));
    if (outside.length) {
      throw new AppError('invalid', 'Invalid request body.', [{ path: 'siteIds', message: 'A token can only be limited to sites its owner belongs to.' }]);
    }
  }
  const secret = newTokenSecret();
  return writeTransaction(async (transaction) => {
    const token = await ApiToken.create(
      { userId: owner.id, name: input.name, tokenHash: hashToken(secret), prefix: displayPrefix(secret), readOnly: input.readOnly, siteIds: input.siteIds },
      { transaction },
    );
    const dto = tokenDto(token);
    await recordAudit(actor, { siteId: null, action: 'token.create', entityType: 'api_token', entityId: token.id, after: dto }, transaction);
    return { ...dto, userName: owner.name, secret };
  });
}

export async function revokeToken(actor: Actor, tokenId: number) {
  return writeTransaction(async (transaction) => {
    const token = await ApiToken.findOne({ where: { id: tokenId, revokedAt: { [Op.is]: null } }, transaction });
    if (!token) throw notFound('active token');
    await token.update({ revokedAt: new Date() }, { transaction });
    await recordAudit(actor, { siteId: null, action: 'token.revoke', entityType: 'api_token', entityId: tokenId, before: { revokedAt: null }, after: { revokedAt: token.revokedAt!.toISOString() } }, transaction);
    return tokenDto(token);
  });
}
