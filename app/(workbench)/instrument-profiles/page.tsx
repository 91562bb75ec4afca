import Link from 'next/link';
import { ProfileImport } from '@/components/profiles/ProfileImport';
import { may, requirePermission } from '@/lib/auth/page';
import { listProfiles } from '@/lib/services/instrument-profiles';

export const metadata = { title: 'Instrument profiles' };

export default async function InstrumentProfilesPage() {
  const actor = await requirePermission('upload.read');
  const profiles = await listProfiles();
  const canWrite = may(actor, 'profile.write');
  return (
    <div className="space-y-5">
      <div>
        <h1 className="page-title">Instrument profiles</h1>
        <p className="text-sm text-ink-soft">How each meter model’s export reads. A profile is made by mapping a new layout from an upload, or imported from a file; every site shares them.</p>
      </div>
      <section className="panel p-5">
        {profiles.length === 0 ? (
          <p className="text-sm text-ink-soft">No profile yet. The first upload of a meter’s layout offers to map it.</p>
        ) : (
          <table className="data-table" data-testid="profile-list">
            <thead><tr><th>Name</th><th>Header fingerprint</th><th className="text-right">Revision</th><th>By</th><th>Changed</th></tr></thead>
            <tbody>
              {profiles.map((p) => (
                <tr key={p.id}>
                  <td><Link href={`/instrument-profiles/${p.id}`} className="font-medium text-accent-700 hover:underline">{p.name}</Link></td>
                  <td className="tag-text text-ink-soft">{p.fingerprint}</td>
                  <td className="text-right">{p.revision}</td>
                  <td>{p.createdBy ?? '—'}</td>
                  <td className="whitespace-nowrap">{new Date(p.updatedAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}</td>
                </tr>
              ))}
            </tbody>
          </table>
        )}
      </section>
      {canWrite ? <ProfileImport /> : <p className="text-sm text-ink-soft">Analysts and admins make, import and edit profiles.</p>}
    </div>
  );
}
