import { AppHeader } from '@/components/AppHeader';
import { requireActor } from '@/lib/auth/page';

// Every page of the workbench reads the actor from the database on each request (not from the cookie alone).
export const dynamic = 'force-dynamic';

export default async function WorkbenchLayout({ children }: { children: React.ReactNode }) {
  const actor = await requireActor();
  return (
    <>
      <AppHeader actor={actor} />
      <div className="mx-auto max-w-7xl px-4 py-6">{children}</div>
    </>
  );
}
