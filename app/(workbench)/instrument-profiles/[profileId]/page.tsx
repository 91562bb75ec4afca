import Link from 'next/link';
import { notFound } from 'next/navigation';
import { ProfileEditor } from '@/components/profiles/ProfileEditor';
import { may, requirePermission } from '@/lib/auth/page';
import { AppError } from '@/lib/http/errors';
import { getProfile } from '@/lib/services/instrument-profiles';

export const metadata = { title: 'Instrument profile' };

export default async function InstrumentProfilePage({ params }: { params: Promise<{ profileId: string }> }) {
  const actor = await requirePermission('upload.read');
  const id = Number((await params).profileId);
  if (!Number.isInteger(id) || id <= 0) notFound();
  const profile = await getProfile(id).catch((err) => {
    if (err instanceof AppError) notFound();
    throw err;
  });
  return (
    <div className="space-y-5">
      <div>
        <Link href="/instrument-profiles" className="text-sm text-ink-soft hover:underline">← Instrument profiles</Link>
        <h1 className="page-title" data-testid="profile-name-heading">{profile.name}</h1>
        <p className="text-sm text-ink-soft">
          Revision {profile.revision} · by {profile.createdBy ?? '—'} · changed {new Date(profile.updatedAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })} ·
          {' '}recognises files by <span className="tag-text">{profile.fingerprint}</span>
        </p>
      </div>
      <ProfileEditor profile={profile} canWrite={may(actor, 'profile.write')} />
    </div>
  );
}
