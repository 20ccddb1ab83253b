// @vitest-environment happy-dom
import { flushPromises } from '@vue/test-utils';
import InputNumber from 'primevue/inputnumber';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { CaptureDetail, SamplesQuery, SamplesResponse } from '../../../../shared/schemas/capture';
import SpanFiguresPanel from '../../../../src/components/SpanFiguresPanel.vue';
import { useSpanFigures } from '../../../../src/composables/useSpanFigures';
import { mountInApp } from '../harness';

const FS = 10_000;
const capture = { id: 3, sampleRate: FS, channels: [{ index: 0, name: 'U', unit: 'V', invalidCount: 0 }, { index: 1, name: 'I', unit: 'A', invalidCount: 300 }] } as CaptureDetail;
/** U is a clean 50 Hz sine; I is overrange (null) over samples 100 to 399 of any span. */
const fetch = vi.fn(async (_id: number, q: SamplesQuery): Promise<SamplesResponse> => {
  const n = Math.round((q.toS! - q.fromS!) * FS);
  const values = Array.from({ length: n }, (_, i) => (q.channel === 1 && i >= 100 && i < 400 ? null : 100 * Math.sin(2 * Math.PI * 50 * (i / FS))));
  return { channel: q.channel, mode: 'raw', t0S: q.fromS!, stepS: 1 / FS, startIndex: 0, sampleCount: n, values };
});

afterEach(() => (document.body.innerHTML = ''));

describe('SpanFiguresPanel', () => {
  it('measures the span typed in, in either order, and shows each channel’s figures or the engine’s reason for none', async () => {
    const state = useSpanFigures(fetch);
    const { wrapper } = mountInApp(SpanFiguresPanel, { props: { capture, state } });
    const [from, to] = wrapper.findAllComponents(InputNumber);
    from.vm.$emit('update:modelValue', 0.06);
    to.vm.$emit('update:modelValue', 0);
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    await vi.waitFor(() => expect(wrapper.find('[data-test=span-reason]').exists()).toBe(true));
    expect(fetch).toHaveBeenCalledWith(3, expect.objectContaining({ fromS: 0, toS: 0.06 }));
    expect(wrapper.find('[data-test=span-reason]').text()).toMatch(/^I: 300 of 600 samples are empty or overrange/);
    // The table holds the channel the engine could analyse, and only that one; 0.06 s is 3 whole cycles, so no banner.
    expect(wrapper.findAll('[data-test=figures-table] thead th').map((th) => th.text())).toEqual(['Quantity', 'U']);
    expect(wrapper.find('[data-test=span-banner]').exists()).toBe(false);
  });

  it('labels its time fields, and names their ids after the capture where a page shows several', () => {
    const { wrapper } = mountInApp(SpanFiguresPanel, { props: { capture, state: useSpanFigures(fetch), idPrefix: 'c3-' } });
    const labels = wrapper.findAll('label').map((l) => l.attributes('for'));
    expect(labels).toEqual(['c3-span-from', 'c3-span-to']);
    expect(labels.every((id) => wrapper.find(`input#${id}`).exists())).toBe(true);
  });
});
