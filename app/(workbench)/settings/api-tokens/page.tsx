import { ApiTokenSettings } from '@/components/settings/ApiTokenSettings';
import { requirePermission } from '@/lib/auth/page';
import { listTokens } from '@/lib/services/api-tokens';
import { listSitesFor } from '@/lib/services/sites';
import { listUsers } from '@/lib/services/users';

export const metadata = { title: 'API tokens' };

export default async function ApiTokenSettingsPage() {
  const actor = await requirePermission('token.manage');
  const [tokens, users, sites] = await Promise.all([listTokens(), listUsers(), listSitesFor(actor)]);
  return (
    <ApiTokenSettings
      tokens={tokens}
      users={users.filter((u) => u.status === 'active').map((u) => ({ id: u.id, name: u.name }))}
      sites={sites.map((s) => ({ id: s.id, name: s.name }))}
    />
  );
}
