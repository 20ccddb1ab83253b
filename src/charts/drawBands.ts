import type uPlot from 'uplot';
import type { Severity } from '../../shared/schemas/annotation';

/** A marked span of time drawn behind the traces. */
export interface Band {
  id: number;
  startS: number;
  endS: number;
  severity: Severity;
  state?: string;
}

const fill: Record<Severity, string> = { info: 'rgba(79,111,179,0.16)', warning: 'rgba(224,165,38,0.22)', fault: 'rgba(194,65,12,0.22)' };
const edge: Record<Severity, string> = { info: 'rgba(79,111,179,0.8)', warning: 'rgba(224,165,38,0.8)', fault: 'rgba(194,65,12,0.8)' };

/** Draws each band as a tinted column (at least 2 px wide, so an instant shows); suggestions with a dashed edge. */
export function drawBands(u: uPlot, bands: Band[]) {
  const ctx = u.ctx;
  for (const b of bands) {
    const x0 = u.valToPos(b.startS, 'x', true);
    const x1 = Math.max(u.valToPos(b.endS, 'x', true), x0 + 2);
    ctx.save();
    ctx.fillStyle = fill[b.severity];
    if (b.state === 'suggested') ctx.setLineDash([4, 3]);
    ctx.fillRect(x0, u.bbox.top, x1 - x0, u.bbox.height);
    ctx.strokeStyle = edge[b.severity];
    ctx.strokeRect(x0, u.bbox.top, x1 - x0, u.bbox.height);
    ctx.restore();
  }
}
