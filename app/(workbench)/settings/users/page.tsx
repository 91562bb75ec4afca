import { UserSettings } from '@/components/settings/UserSettings';
import { requirePermission } from '@/lib/auth/page';
import { listSitesFor } from '@/lib/services/sites';
import { listUsers } from '@/lib/services/users';

export const metadata = { title: 'Users and roles' };

export default async function UserSettingsPage() {
  const actor = await requirePermission('user.manage');
  const [users, sites] = await Promise.all([listUsers(), listSitesFor(actor)]);
  return <UserSettings users={users} sites={sites.map((s) => ({ id: s.id, name: s.name }))} selfId={actor.userId} />;
}
