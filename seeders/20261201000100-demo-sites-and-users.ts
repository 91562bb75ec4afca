import bcrypt from 'bcryptjs';
import { Op } from 'sequelize';
import { displayPrefix, hashToken } from '@/lib/auth/tokens';
import { ApiToken, Site, SiteMembership, User } from '@/models';
import { DEMO_ANALYST_TOKEN, DEMO_PASSWORDS, DEMO_SITES, DEMO_USERS } from './demo-scenario';

export async function up() {
  const sites = await Site.bulkCreate(DEMO_SITES.map((s) => ({ ...s, ambientC: 20 })));
  const siteIdByCode = new Map(sites.map((s) => [s.code, s.id]));
  for (const demo of DEMO_USERS) {
    const user = await User.create({
      email: demo.email, name: demo.name, role: demo.role,
      passwordHash: await bcrypt.hash(DEMO_PASSWORDS[demo.role], 10),
    });
    await SiteMembership.bulkCreate(demo.sites.map((code) => ({ userId: user.id, siteId: siteIdByCode.get(code)! })));
    if (demo.role === 'analyst') {
      await ApiToken.create({
        userId: user.id, name: 'Demo scripts', tokenHash: hashToken(DEMO_ANALYST_TOKEN),
        prefix: displayPrefix(DEMO_ANALYST_TOKEN), readOnly: false, siteIds: null,
      });
    }
  }
}

export async function down() {
  await User.destroy({ where: { email: { [Op.in]: DEMO_USERS.map((u) => u.email) } } });
  await Site.destroy({ where: { code: { [Op.in]: DEMO_SITES.map((s) => s.code) } } });
}
