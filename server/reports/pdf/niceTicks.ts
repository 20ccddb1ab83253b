/**
 * About `target` round tick values (1, 2, 2.5 or 5 times a power of ten) spanning [min, max], and the
 * range widened to the outer ticks. A zero or non-finite span is widened around its value first.
 */
export function niceTicks(min: number, max: number, target = 5): { ticks: number[]; min: number; max: number } {
  if (!Number.isFinite(min) || !Number.isFinite(max)) return { ticks: [0, 1], min: 0, max: 1 };
  if (max - min <= Math.abs(max) * 1e-12) {
    const pad = Math.abs(max) * 0.1 || 1;
    [min, max] = [min - pad, max + pad];
  }
  const raw = (max - min) / target;
  const power = 10 ** Math.floor(Math.log10(raw));
  const step = ([1, 2, 2.5, 5, 10].find((m) => m * power >= raw) ?? 10) * power;
  const lo = Math.floor(min / step + 1e-9) * step;
  const hi = Math.ceil(max / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let v = lo; v <= hi + step * 1e-6; v += step) ticks.push(Math.abs(v) < step * 1e-9 ? 0 : v);
  return { ticks, min: lo, max: hi };
}
