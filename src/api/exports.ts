import type { ComplianceRequest, ComplianceResult, StoredLimitCheck } from '../../shared/schemas/compliance';
import type { ReportOptions } from '../../shared/schemas/report';
import { api, clientHeaders, toError } from './http';

export type ExportKind = 'figures' | 'harmonics' | 'samples';

/** The address of a capture's CSV or JSON export; a plain link downloads it, streaming. */
export function exportUrl(captureId: number, kind: ExportKind, format: 'csv' | 'json', q: { decimal?: 'point' | 'comma'; fromS?: number; toS?: number } = {}): string {
  const params = new URLSearchParams();
  if (format === 'csv' && q.decimal === 'comma') params.set('decimal', 'comma');
  if (kind === 'samples' && q.fromS !== undefined) params.set('fromS', String(q.fromS));
  if (kind === 'samples' && q.toS !== undefined) params.set('toS', String(q.toS));
  const query = params.toString();
  return `/api/captures/${captureId}/${kind}.${format}${query ? `?${query}` : ''}`;
}

export const reportUrl = (kind: 'captures' | 'comparisons', id: number) => `/api/${kind}/${id}/report.pdf`;
export const sharedReportUrl = (token: string, captureId?: number) =>
  `/api/shared/${encodeURIComponent(token)}${captureId === undefined ? '' : `/captures/${captureId}`}/report.pdf`;

/**
 * Downloads a report with the person's title, summary, name and company: a POST (the summary is too long
 * for an address), so it goes through fetch with the client header every API call carries (the origin
 * check refuses a POST without it), and is saved from a blob.
 */
export async function downloadReport(kind: 'captures' | 'comparisons', id: number, options: ReportOptions): Promise<void> {
  const res = await fetch(reportUrl(kind, id), {
    method: 'POST',
    credentials: 'same-origin',
    headers: { ...clientHeaders, 'content-type': 'application/json' },
    body: JSON.stringify(options),
  });
  if (!res.ok) throw await toError(res);
  const name = /filename="?([^";]+)"?/.exec(res.headers.get('content-disposition') ?? '')?.[1] ?? 'crestline-report.pdf';
  const url = URL.createObjectURL(await res.blob());
  const a = Object.assign(document.createElement('a'), { href: url, download: name });
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

export const runCompliance = (captureId: number, req: ComplianceRequest) => api<ComplianceResult>('POST', `/captures/${captureId}/compliance`, req);
export const listLimitChecks = (captureId: number) => api<{ items: StoredLimitCheck[] }>('GET', `/captures/${captureId}/limit-checks`);
export const keepLimitCheck = (captureId: number, req: ComplianceRequest) => api<StoredLimitCheck>('POST', `/captures/${captureId}/limit-checks`, req);
export const removeLimitCheck = (id: number) => api<void>('DELETE', `/limit-checks/${id}`);
