import 'server-only';
import { Op, UniqueConstraintError } from 'sequelize';
import type { Actor } from '@/lib/auth/actor';
import { hashPassword } from '@/lib/auth/sign-in';
import { writeTransaction } from '@/lib/db';
import { AppError, notFound } from '@/lib/http/errors';
import type { UserInput, UserUpdate } from '@/lib/validation/user';
import { Site, SiteMembership, User } from '@/models';
import type { Transaction } from 'sequelize';
import { recordAudit } from './audit';
import { userDto } from './dto';

async function membershipsByUser(userIds: number[]) {
  const rows = await SiteMembership.findAll({ where: { userId: { [Op.in]: userIds } }, attributes: ['userId', 'siteId'] });
  const map = new Map<number, number[]>();
  for (const r of rows) map.set(r.userId, [...(map.get(r.userId) ?? []), r.siteId]);
  return map;
}

export async function listUsers() {
  const users = await User.findAll({ order: [['name', 'ASC']] });
  const sites = await membershipsByUser(users.map((u) => u.id));
  return users.map((u) => userDto(u, sites.get(u.id) ?? []));
}

async function setSites(userId: number, siteIds: number[], transaction: Transaction) {
  const found = await Site.count({ where: { id: { [Op.in]: siteIds } }, transaction });
  if (found !== new Set(siteIds).size) {
    throw new AppError('invalid', 'Invalid request body.', [{ path: 'siteIds', message: 'One of these sites does not exist.' }]);
  }
  await SiteMembership.destroy({ where: { userId }, transaction });
  await SiteMembership.bulkCreate([...new Set(siteIds)].map((siteId) => ({ userId, siteId })), { transaction });
}

export async function createUser(actor: Actor, input: UserInput) {
  const passwordHash = await hashPassword(input.password);
  return writeTransaction(async (transaction) => {
    const user = await User.create({ email: input.email, name: input.name, role: input.role, passwordHash }, { transaction }).catch((err) => {
      if (err instanceof UniqueConstraintError) throw new AppError('conflict', 'A user with this e-mail already exists.', [{ path: 'email', message: 'Already in use.' }]);
      throw err;
    });
    await setSites(user.id, input.siteIds, transaction);
    const dto = userDto(user, input.siteIds);
    await recordAudit(actor, { siteId: null, action: 'user.create', entityType: 'user', entityId: user.id, after: dto }, transaction);
    return dto;
  });
}

export async function updateUser(actor: Actor, userId: number, input: UserUpdate) {
  if (userId === actor.userId && (input.status === 'disabled' || (input.role && input.role !== 'admin'))) {
    throw new AppError('invalid', 'You cannot disable yourself or give up your own admin role; ask another admin.');
  }
  const passwordHash = input.password ? await hashPassword(input.password) : undefined;
  return writeTransaction(async (transaction) => {
    const user = await User.findByPk(userId, { transaction });
    if (!user) throw notFound('user');
    const beforeSites = (await membershipsByUser([userId])).get(userId) ?? [];
    const before = userDto(user, beforeSites);
    const { password: _password, siteIds, ...fields } = input;
    void _password;
    await user.update({ ...fields, ...(passwordHash ? { passwordHash } : {}) }, { transaction });
    if (siteIds) await setSites(userId, siteIds, transaction);
    const after = userDto(user, siteIds ?? beforeSites);
    await recordAudit(actor, {
      siteId: null, action: 'user.update', entityType: 'user', entityId: userId,
      before, after: { ...after, ...(passwordHash ? { password: 'changed' } : {}) },
    }, transaction);
    return after;
  });
}
