// @vitest-environment happy-dom
import { afterEach, describe, expect, it, vi } from 'vitest';
import { ref } from 'vue';
import { useChartGestures } from '../../../../src/composables/useChartGestures';
import { withSetup } from '../harness';

/** A plot area 100 px from the left edge, 400 px wide: x = 100 + 400·fraction. */
const area = { left: 100, width: 400 } as DOMRect;

function setup() {
  const host = ref<HTMLElement | null>(document.createElement('div'));
  document.body.appendChild(host.value!);
  const g = { area: () => area, start: vi.fn(), drag: vi.fn(), pinch: vi.fn(), end: vi.fn() };
  withSetup(() => useChartGestures(host, g));
  const send = (type: string, pointerId: number, clientX: number, pointerType = 'touch') => host.value!.dispatchEvent(new PointerEvent(type, { pointerId, clientX, pointerType, bubbles: true }));
  return { g, send };
}

afterEach(() => (document.body.innerHTML = ''));

describe('useChartGestures', () => {
  it('one finger drags: positions as fractions of the plot area, then the end', () => {
    const { g, send } = setup();
    send('pointerdown', 1, 300);
    send('pointermove', 1, 200);
    send('pointerup', 1, 200);
    expect(g.start).toHaveBeenCalledTimes(1);
    expect(g.drag).toHaveBeenLastCalledWith(0.5, 0.25);
    expect(g.end).toHaveBeenCalledTimes(1);
  });

  it('two fingers pinch: how many times their first distance, about their first midpoint', () => {
    const { g, send } = setup();
    send('pointerdown', 1, 280);
    send('pointerdown', 2, 320);
    send('pointermove', 1, 240);
    send('pointermove', 2, 360);
    expect(g.pinch).toHaveBeenLastCalledWith(3, 0.5);
    send('pointerup', 1, 240);
    // With one finger still down, moving it does nothing: the pinch holds until both lift.
    send('pointermove', 2, 460);
    expect(g.drag).not.toHaveBeenCalled();
    send('pointerup', 2, 460);
    expect(g.end).toHaveBeenCalledTimes(1);
  });

  it('leaves the mouse to the chart’s own drag-to-select', () => {
    const { g, send } = setup();
    send('pointerdown', 1, 300, 'mouse');
    send('pointermove', 1, 200, 'mouse');
    send('pointerup', 1, 200, 'mouse');
    expect([g.start, g.drag, g.end].map((f) => f.mock.calls.length)).toEqual([0, 0, 0]);
  });
});
