import {
  WORK_ORDER_PRIORITY_LABELS, WORK_ORDER_STATUS_LABELS,
} from '@/lib/api/work-order-routes';

// Each state shows a shape and a word as well as a colour (Okabe–Ito, colour-blind safe).
const STATUS_STYLE: Record<string, { shape: string; colour: string }> = {
  open: { shape: '○', colour: '#6b6b6b' },
  scheduled: { shape: '◷', colour: '#0072B2' },
  done: { shape: '✓', colour: '#56B4E9' },
  verified: { shape: '✔', colour: '#009E73' },
  reopened: { shape: '↺', colour: '#D55E00' },
};
const PRIORITY_STYLE: Record<string, { shape: string; colour: string }> = {
  urgent: { shape: '▲▲', colour: '#D55E00' },
  high: { shape: '▲', colour: '#E69F00' },
  normal: { shape: '●', colour: '#0072B2' },
  low: { shape: '▽', colour: '#6b6b6b' },
};

function Badge({ style, label, data, bold = false }: { style: { shape: string; colour: string }; label: string; data: Record<string, string>; bold?: boolean }) {
  return (
    <span className={`inline-flex items-center gap-1 whitespace-nowrap text-xs ${bold ? 'font-semibold' : 'font-medium'}`} {...data}>
      <span aria-hidden="true" style={{ color: style.colour }}>{style.shape}</span>
      {label}
    </span>
  );
}

export function WorkOrderStatusBadge({ status }: { status: string }) {
  const label = WORK_ORDER_STATUS_LABELS[status as keyof typeof WORK_ORDER_STATUS_LABELS] ?? status;
  return <Badge style={STATUS_STYLE[status] ?? STATUS_STYLE.open} label={label} data={{ 'data-status': status }} />;
}

export function PriorityBadge({ priority }: { priority: string }) {
  const label = WORK_ORDER_PRIORITY_LABELS[priority as keyof typeof WORK_ORDER_PRIORITY_LABELS] ?? priority;
  return <Badge style={PRIORITY_STYLE[priority] ?? PRIORITY_STYLE.normal} label={label} data={{ 'data-priority': priority }} bold />;
}

export function formatMoney(value: number | null, currency: string) {
  if (value === null) return '—';
  try {
    return new Intl.NumberFormat('en-GB', { style: 'currency', currency, maximumFractionDigits: 0 }).format(value);
  } catch {
    return `${Math.round(value).toLocaleString('en-GB')} ${currency}`;
  }
}
