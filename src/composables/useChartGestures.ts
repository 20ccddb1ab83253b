import { onBeforeUnmount, onMounted, type Ref } from 'vue';

/** What a touch gesture on a chart does; positions are fractions of the plot area's width (0: left edge). */
export interface ChartGestures {
  /** The plot area the fractions refer to; null while there is no plot. */
  area: () => DOMRect | null;
  /** A gesture begins: remember what it changes. */
  start: () => void;
  /** One finger moved from `from` to `to`. */
  drag: (from: number, to: number) => void;
  /** Two fingers are `scale` times as far apart as when they touched, around `anchor`. */
  pinch: (scale: number, anchor: number) => void;
  /** Every finger lifted: keep what the gesture showed. */
  end: () => void;
}

/**
 * Touch gestures on a chart, from pointer events: drag with one finger, pinch with two. Mouse and pen
 * keep uPlot's own drag-to-select. The host needs `touch-action: pan-y`, so a vertical swipe still scrolls.
 */
export function useChartGestures(host: Ref<HTMLElement | null>, g: ChartGestures) {
  const fingers = new Map<number, number>();
  let kind: 'none' | 'drag' | 'pinch' = 'none';
  // Lifting one finger of a pinch holds the zoom where it is until the other lifts too.
  let held = false;
  let from = 0;
  let spread = 1;
  let anchor = 0.5;

  const fraction = (clientX: number) => {
    const r = g.area();
    return r && r.width > 0 ? (clientX - r.left) / r.width : 0;
  };
  const xs = () => [...fingers.values()];

  function begin() {
    const [a, b] = xs();
    held = false;
    if (fingers.size === 1) {
      kind = 'drag';
      from = fraction(a);
    } else if (fingers.size === 2) {
      kind = 'pinch';
      spread = Math.max(1, Math.abs(a - b));
      anchor = fraction((a + b) / 2);
    } else {
      kind = 'none';
      return;
    }
    g.start();
  }

  function down(e: PointerEvent) {
    if (e.pointerType !== 'touch' || !g.area()) return;
    host.value?.setPointerCapture?.(e.pointerId);
    fingers.set(e.pointerId, e.clientX);
    begin();
  }
  function move(e: PointerEvent) {
    if (!fingers.has(e.pointerId)) return;
    fingers.set(e.pointerId, e.clientX);
    if (held) return;
    const [a, b] = xs();
    if (kind === 'drag') g.drag(from, fraction(a));
    else if (kind === 'pinch') g.pinch(Math.max(1, Math.abs(a - b)) / spread, anchor);
  }
  function up(e: PointerEvent) {
    if (!fingers.delete(e.pointerId)) return;
    if (fingers.size > 0) {
      held = true;
      return;
    }
    if (kind !== 'none') g.end();
    kind = 'none';
    held = false;
  }

  const events: [string, (e: PointerEvent) => void][] = [['pointerdown', down], ['pointermove', move], ['pointerup', up], ['pointercancel', up]];
  onMounted(() => events.forEach(([name, fn]) => host.value?.addEventListener(name, fn as EventListener)));
  onBeforeUnmount(() => events.forEach(([name, fn]) => host.value?.removeEventListener(name, fn as EventListener)));
}
