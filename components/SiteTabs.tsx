'use client';

import Link from 'next/link';
import { usePathname } from 'next/navigation';

export type SiteTab = { href: string; label: string };

export function SiteTabs({ tabs }: { tabs: SiteTab[] }) {
  const pathname = usePathname();
  // The longest matching prefix is the current tab (Overview is a prefix of all).
  const current = tabs.filter((t) => pathname === t.href || pathname.startsWith(t.href + '/')).sort((a, b) => b.href.length - a.href.length)[0];
  return (
    <nav className="flex gap-1 border-b border-line text-sm" aria-label="Site">
      {tabs.map((tab) => {
        const active = tab === current;
        return (
          <Link
            key={tab.href}
            href={tab.href}
            aria-current={active ? 'page' : undefined}
            className={`-mb-px border-b-2 px-3 py-2 ${active ? 'border-accent-600 font-medium text-ink' : 'border-transparent text-ink-soft hover:text-ink'}`}
          >
            {tab.label}
          </Link>
        );
      })}
    </nav>
  );
}
