import { formatNumber, formatQuantity } from '@/lib/format/quantity';

/** Where on the curve a derived value applies: { 'temperature[K]': 300 } → 'temperature 300 K'. */
export function formatAt(at: Record<string, number> | undefined): string {
  if (!at) return '';
  return Object.entries(at)
    .map(([key, value]) => {
      const m = /^(.+)\[(.+)\]$/.exec(key);
      return m ? `${m[1]} ${formatQuantity(value, m[2])}` : `${key} ${formatNumber(value)}`;
    })
    .join(', ');
}
