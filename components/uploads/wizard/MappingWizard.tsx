'use client';

import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { useEffect, useRef, useState } from 'react';
import type { InstrumentProfile } from '@/lib/import/instrument-profile';
import { callApi, formatWhen, uploadPath, wizardPath } from '../apiClient';
import { ColumnsStep } from './ColumnsStep';
import { startingProfile, WIZARD_STEPS, type WizardState, type WizardStep } from './draftProfile';
import { FormatStep } from './FormatStep';
import { SaveStep } from './SaveStep';


type SaveState = 'saved' | 'saving' | 'unsaved' | 'failed';

/**
 * The column-mapping wizard for one layout. Each step is its own route segment; the draft
 * profile is saved on the upload (keyed by the layout's fingerprint) as it is edited and on
 * every step change, so a refresh or a colleague's link opens the same step with the same choices.
 */
export function MappingWizard({ step, state }: { step: WizardStep; state: WizardState }) {
  const router = useRouter();
  const { siteId, uploadId, fingerprint, layout } = state;
  const [profile, setProfile] = useState<InstrumentProfile>(() => startingProfile(layout?.detection ?? null, fingerprint, state.draft?.profile ?? null));
  const [saveState, setSaveState] = useState<SaveState>('saved');
  const first = useRef(true);

  async function saveDraft(atStep: string, p: InstrumentProfile) {
    setSaveState('saving');
    const result = await callApi(`/api/uploads/${uploadId}/mapping-draft`, { method: 'PUT', body: { fingerprint, step: atStep, profile: p } });
    setSaveState(result.ok ? 'saved' : 'failed');
    return result.ok;
  }

  // Edits are kept on the server shortly after they are made.
  useEffect(() => {
    if (first.current) {
      first.current = false;
      if (!state.draft || state.draft.step !== step) void saveDraft(step, profile);
      return;
    }
    setSaveState('unsaved');
    const timer = setTimeout(() => void saveDraft(step, profile), 600);
    return () => clearTimeout(timer);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [profile]);

  async function go(next: WizardStep) {
    await saveDraft(next, profile);
    router.push(wizardPath(siteId, uploadId, fingerprint, next));
  }

  if (!layout) {
    return (
      <section className="panel space-y-3 p-5">
        <h2 className="font-semibold">This layout is mapped</h2>
        <p className="text-sm text-ink-soft">No file of this upload waits for a mapping of this layout any more: an instrument profile reads it now.</p>
        <Link href={uploadPath(siteId, uploadId)} className="btn-quiet">Back to the upload</Link>
      </section>
    );
  }

  const index = WIZARD_STEPS.findIndex((s) => s.step === step);
  return (
    <div className="space-y-5" data-testid="mapping-wizard" data-step={step}>
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <Link href={uploadPath(siteId, uploadId)} className="text-sm text-ink-soft hover:underline">← Upload #{uploadId}</Link>
          <h2 className="text-lg font-semibold">Map a new layout</h2>
          <p className="text-sm text-ink-soft">
            {layout.fileNames.length} file{layout.fileNames.length === 1 ? '' : 's'} of this layout: {layout.fileNames.slice(0, 3).join(', ')}{layout.fileNames.length > 3 ? ', …' : ''}.
            Once saved as an instrument profile, later files of this layout are read without asking.
          </p>
        </div>
        <p className="text-xs text-ink-soft" role="status" data-testid="draft-state">
          {saveState === 'saving' ? 'Saving the draft…' : saveState === 'unsaved' ? 'Changes not saved yet' : saveState === 'failed' ? 'The draft could not be saved' : 'Draft saved on the server'}
          {state.draft && saveState === 'saved' ? ` · last by ${state.draft.updatedBy}, ${formatWhen(state.draft.updatedAt)}` : ''}
        </p>
      </div>

      <ol className="flex flex-wrap gap-2 text-sm" aria-label="Steps">
        {WIZARD_STEPS.map((s, i) => (
          <li key={s.step}>
            <button
              type="button"
              onClick={() => go(s.step)}
              aria-current={s.step === step ? 'step' : undefined}
              className={`rounded-full border px-3 py-1 ${s.step === step ? 'border-accent-600 bg-accent-50 font-medium text-accent-800' : i < index ? 'border-line-strong text-ink' : 'border-line text-ink-soft'}`}
            >
              <span aria-hidden="true">{i < index ? '✓ ' : `${i + 1}. `}</span>{s.label}
            </button>
          </li>
        ))}
        <li className="flex items-center text-ink-faint">then match tags to the register, if any are new</li>
      </ol>

      {step === 'format' && <FormatStep detection={layout.detection} profile={profile} onChange={setProfile} />}
      {step === 'columns' && <ColumnsStep detection={layout.detection} profile={profile} onChange={setProfile} uploadId={uploadId} fileId={layout.fileIds[0]} siteTimeZone={state.siteTimeZone} />}
      {step === 'save' && <SaveStep profile={profile} onChange={setProfile} uploadId={uploadId} fingerprint={fingerprint} onSaved={() => router.push(uploadPath(siteId, uploadId))} siteTimeZone={state.siteTimeZone} />}

      <div className="flex justify-between border-t border-line pt-4">
        {index > 0 ? <button type="button" className="btn-quiet" onClick={() => go(WIZARD_STEPS[index - 1].step)}>← {WIZARD_STEPS[index - 1].label}</button> : <span />}
        {index < WIZARD_STEPS.length - 1 && <button type="button" className="btn-primary" onClick={() => go(WIZARD_STEPS[index + 1].step)}>Next: {WIZARD_STEPS[index + 1].label} →</button>}
      </div>
    </div>
  );
}
