import { formatRatio, formatSI } from '../units';
import { unitOfKind, type QuantityKind } from './quantityRows';

/** A quantity as the figures tables print it: SI prefixes in the channel's unit, ratios to 4 digits, percentages to 2 decimals. */
export function formatQuantity(kind: QuantityKind, v: number | null, channelUnit: string): string {
  if (v === null || !Number.isFinite(v)) return '—';
  switch (kind) {
    case 'unit':
      return formatSI(v, channelUnit);
    case 'ratio':
      return formatRatio(v);
    case 'hz':
      return formatSI(v, 'Hz', 6);
    case 'percent':
      return `${v.toFixed(2)} %`;
    case 'cycles':
      return String(v);
    default:
      return formatSI(v, unitOfKind(kind, channelUnit), 4);
  }
}

/** A date and time in UTC, to the minute: "2026-12-02 14:05 UTC". */
export const formatUtc = (d: Date | string) => `${new Date(d).toISOString().slice(0, 16).replace('T', ' ')} UTC`;
