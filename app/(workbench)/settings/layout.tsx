import { SiteTabs } from '@/components/SiteTabs';
import { requirePermission } from '@/lib/auth/page';

export default async function SettingsLayout({ children }: { children: React.ReactNode }) {
  await requirePermission('user.manage');
  return (
    <div className="space-y-5">
      <h1 className="page-title">Settings</h1>
      <SiteTabs tabs={[
        { href: '/settings/users', label: 'Users and roles' },
        { href: '/settings/sites', label: 'Sites' },
        { href: '/settings/api-tokens', label: 'API tokens' },
        { href: '/settings/mailbox', label: 'Development mailbox' },
      ]} />
      {children}
    </div>
  );
}
