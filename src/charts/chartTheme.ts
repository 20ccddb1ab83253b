export { CHANNEL_COLOURS } from '../../shared/reports/palette';

/** Axis and grid colours read from the current theme, so charts follow light and dark mode. */
export function chartColours() {
  const css = getComputedStyle(document.documentElement);
  const text = css.getPropertyValue('--p-text-muted-color').trim() || '#686357';
  const grid = css.getPropertyValue('--p-content-border-color').trim() || '#e0ddd5';
  return { text, grid };
}

export const axis = (label: string, scale?: string, side?: 1 | 3) => {
  const { text, grid } = chartColours();
  return {
    label,
    // uPlot takes a key set to undefined as a value, so only pass scale and side when given.
    ...(scale ? { scale } : {}),
    ...(side ? { side } : {}),
    stroke: text,
    grid: { stroke: grid, width: 1 },
    ticks: { stroke: grid, width: 1 },
    font: '12px Inter, sans-serif',
    labelFont: '12px Inter, sans-serif',
  };
};
