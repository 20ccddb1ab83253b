import type { HarmonicsExport } from '../../shared/schemas/export';
import type { ReadyCapture } from '../services/readyCapture';
import { channelHead, type ExportTable } from './figuresExport';

/**
 * harmonics.csv: one row per order; for each channel its frequency, RMS, % of the fundamental and phase,
 * and the IEC 61000-4-7 group and subgroup where they were computed.
 */
export function harmonicsTable({ detail, analyses }: ReadyCapture): ExportTable {
  const header = ['Order'];
  detail.channels.forEach((c, i) => {
    header.push(`${c.name} frequency (Hz)`, channelHead(c, 'RMS'), `${c.name} % of fundamental`, `${c.name} phase (°)`);
    if (analyses[i].iec) header.push(channelHead(c, 'IEC group'), channelHead(c, 'IEC subgroup'));
  });
  const top = Math.max(0, ...analyses.map((a) => a.harmonics.length), ...analyses.map((a) => a.iec?.groups.length ?? 0));
  const rows = Array.from({ length: top }, (_, k) => {
    const order = k + 1;
    const row: (string | number | null)[] = [order];
    analyses.forEach((a) => {
      const h = a.harmonics[k];
      const f1 = a.harmonics[0]?.rms;
      row.push(h?.frequency ?? null, h?.rms ?? null, h && f1 ? (100 * h.rms) / f1 : null, h?.phaseDeg ?? null);
      if (a.iec) {
        const g = a.iec.groups.find((x) => x.order === order);
        row.push(g?.groupRms ?? null, g?.subgroupRms ?? null);
      }
    });
    return row;
  });
  return { header, rows };
}

export function harmonicsJson({ detail, analyses }: ReadyCapture): HarmonicsExport {
  return {
    captureId: detail.id,
    name: detail.name,
    channels: detail.channels.map((c, i) => {
      const a = analyses[i];
      const f1 = a.harmonics[0]?.rms;
      return {
        index: c.index,
        name: c.name,
        unit: c.unit,
        frequency: a.frequency,
        thdPercent: a.thdPercent,
        thdRPercent: a.thdRPercent,
        harmonics: a.harmonics.map((h) => ({ ...h, percentOfFundamental: f1 ? (100 * h.rms) / f1 : null })),
        iec: a.iec,
      };
    }),
  };
}
