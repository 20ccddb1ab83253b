// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { analyzeChannel } from '../../../../shared/analysis';
import FiguresTable from '../../../../src/components/FiguresTable.vue';
import { FIGURE_ROWS } from '../../../../src/figures/figureRows';
import { mountInApp } from '../harness';

const FS = 10_000;
const sine = (peak: number) => analyzeChannel(Float64Array.from({ length: 2000 }, (_, i) => peak * Math.sin(2 * Math.PI * 50 * (i / FS))), FS);
const channels = [{ index: 0, name: 'L1-N', unit: 'V', invalidCount: 0 }, { index: 1, name: 'L1', unit: 'A', invalidCount: 0 }];

afterEach(() => (document.body.innerHTML = ''));

describe('FiguresTable', () => {
  const { wrapper } = mountInApp(FiguresTable, { props: { channels, analyses: [sine(325), sine(28.284)] } });

  it('has a column per channel and a row per figure, in the shared order', () => {
    expect(wrapper.findAll('thead th').map((th) => th.text())).toEqual(['Quantity', 'L1-N', 'L1']);
    expect(wrapper.findAll('tbody tr').map((tr) => tr.attributes('data-test'))).toEqual(FIGURE_ROWS.map((r) => `figure-${r.key}`));
  });

  it('prints each channel in its own unit: 325 V and 28.284 A peak are 229.8 V and 20.00 A RMS (x/√2)', () => {
    expect(wrapper.findAll('[data-test=figure-rms] td').map((td) => td.text())).toEqual(['229.8 V', '20.00 A']);
  });

  it('heads each row, with the figure’s meaning as its title', () => {
    const head = wrapper.find('[data-test=figure-crestFactor] th');
    expect(head.attributes('scope')).toBe('row');
    expect(head.attributes('title')).toMatch(/Peak ÷ true RMS/);
  });

  it('scrolls in a named box the keyboard can reach, when wider than the screen', () => {
    const box = wrapper.find('[data-test=figures-box]');
    expect(box.attributes()).toMatchObject({ tabindex: '0', role: 'region', 'aria-label': 'Figures' });
  });
});
