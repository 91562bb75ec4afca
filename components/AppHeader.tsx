import Link from 'next/link';
import type { Actor } from '@/lib/auth/actor';
import { may } from '@/lib/auth/page';
import { ROLE_LABELS } from '@/lib/domain/vocabulary';
import { PlumeMark } from './PlumeMark';
import { SignOutButton } from './SignOutButton';

export function AppHeader({ actor }: { actor: Actor }) {
  return (
    <header className="border-b border-line bg-surface-raised">
      <div className="mx-auto flex h-14 max-w-7xl items-center gap-6 px-4">
        <Link href="/" className="flex items-center gap-2 font-semibold tracking-tight">
          <PlumeMark />
          Plumeward
        </Link>
        <nav className="flex items-center gap-4 text-sm text-ink-soft" aria-label="Main">
          <Link href="/" className="hover:text-ink">Sites</Link>
          {may(actor, 'upload.read') && <Link href="/instrument-profiles" className="hover:text-ink">Instrument profiles</Link>}
          {may(actor, 'user.manage') && <Link href="/settings" className="hover:text-ink">Settings</Link>}
        </nav>
        <div className="ml-auto flex items-center gap-3 text-sm">
          <span className="text-ink">{actor.name}</span>
          <span className="rounded-full border border-line-strong px-2 py-0.5 text-xs text-ink-soft" data-testid="role-badge">
            {ROLE_LABELS[actor.role]}
          </span>
          <SignOutButton />
        </div>
      </div>
    </header>
  );
}
