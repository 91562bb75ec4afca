import { PlumeMark } from '@/components/PlumeMark';

/** The pages people see before they are signed in: the mark, the name, and one card. */
export default function AuthLayout({ children }: { children: React.ReactNode }) {
  return (
    <main className="flex min-h-screen items-center justify-center bg-surface-sunken px-4">
      <div className="w-full max-w-sm">
        <div className="mb-6 flex items-center gap-2">
          <PlumeMark className="h-8 w-8" />
          <div>
            <div className="text-lg font-semibold tracking-tight">Plumeward</div>
            <div className="text-xs text-ink-soft">Steam-trap survey workbench</div>
          </div>
        </div>
        {children}
      </div>
    </main>
  );
}
