// How outcome figures read on screen: money in the site currency, flows and masses in the site's units.
import { formatFigure, type QuantityKind, type UnitSystem } from '@/lib/analysis/units';

export function money(value: number | null, currency: string): string {
  if (value === null || !Number.isFinite(value)) return '—';
  return new Intl.NumberFormat('en-GB', { style: 'currency', currency, maximumFractionDigits: 0 }).format(value);
}

export function quantity(value: number | null, kind: QuantityKind, units: UnitSystem, digits?: number): string {
  return value === null || !Number.isFinite(value) ? '—' : formatFigure(value, kind, units, digits).text;
}

export function percent(share: number | null): string {
  return share === null || !Number.isFinite(share) ? '—' : `${(share * 100).toFixed(1)} %`;
}
