/** A span of time on a chart's x axis, in seconds: [from, to]. */
export type TimeRange = readonly [number, number];

/** The range moved or cut so that it lies within `full`; a range wider than `full` becomes `full`. */
export function clampRange([from, to]: TimeRange, [lo, hi]: TimeRange): TimeRange {
  const width = to - from;
  if (width >= hi - lo) return [lo, hi];
  if (from < lo) return [lo, lo + width];
  if (to > hi) return [hi - width, hi];
  return [from, to];
}

/** The range shifted by `fraction` of its width (positive: later), kept within `full`. */
export function panBy(range: TimeRange, full: TimeRange, fraction: number): TimeRange {
  const shift = (range[1] - range[0]) * fraction;
  return clampRange([range[0] + shift, range[1] + shift], full);
}

/**
 * The range scaled by `factor` (below 1 zooms in) about the instant at `anchor` (0: its start, 1: its end),
 * which stays where it is on the screen; never narrower than `minWidth`, kept within `full`.
 */
export function zoomAbout(range: TimeRange, full: TimeRange, factor: number, anchor = 0.5, minWidth = 0): TimeRange {
  const width = range[1] - range[0];
  const next = Math.max(width * factor, minWidth);
  const at = range[0] + width * anchor;
  return clampRange([at - next * anchor, at - next * anchor + next], full);
}
