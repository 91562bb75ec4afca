import { VERDICT_LABELS, type VerdictCode } from '@/lib/analysis/verdict-codes';

// Okabe–Ito colour-blind-safe colours, each paired with a shape and the word (never colour alone).
export const VERDICT_STYLE: Record<VerdictCode, { colour: string; shape: string }> = {
  blowing: { colour: '#D55E00', shape: '▲' },
  leaking: { colour: '#E69F00', shape: '◆' },
  backing_up: { colour: '#CC79A7', shape: '▼' },
  cold: { colour: '#0072B2', shape: '■' },
  background_noise: { colour: '#56B4E9', shape: '◌' },
  inconclusive: { colour: '#6b6b6b', shape: '?' },
  out_of_service: { colour: '#3d3d3d', shape: '–' },
  working: { colour: '#009E73', shape: '●' },
};

export function VerdictBadge({ code, muted = false }: { code: string | null; muted?: boolean }) {
  if (!code || !(code in VERDICT_STYLE)) return <span className="text-xs text-ink-faint">no verdict</span>;
  const style = VERDICT_STYLE[code as VerdictCode];
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap text-xs font-medium ${muted ? 'opacity-70' : ''}`} data-verdict={code}>
      <span aria-hidden="true" style={{ color: style.colour }}>{style.shape}</span>
      <span>{VERDICT_LABELS[code as VerdictCode]}</span>
    </span>
  );
}
