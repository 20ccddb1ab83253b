// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import ComparisonTable from '../../../../src/components/ComparisonTable.vue';
import { mountInApp } from '../harness';

afterEach(() => (document.body.innerHTML = ''));

describe('ComparisonTable', () => {
  const rows = [{ key: 'rms', label: 'True RMS (AC+DC)', hint: 'heating value', cells: [{ text: '229.8 V', difference: '' }, { text: '212.1 V', difference: '-17.68 V (-7.7 %)' }] }];
  const { wrapper } = mountInApp(ComparisonTable, { props: { names: ['before', 'after'], rows } });

  it('heads a column per capture and says the later ones show differences to the first', () => {
    expect(wrapper.findAll('thead th').map((th) => th.text())).toEqual(['Quantity', 'before', 'after (difference to the first)']);
  });

  it('names each cell by its capture, for the stacked rows of a narrow screen', () => {
    const cells = wrapper.findAll('[data-test=compare-rms] td');
    expect(cells.map((c) => c.attributes('data-name'))).toEqual(['before', 'after']);
    expect(cells[1].text()).toBe('212.1 V-17.68 V (-7.7 %)');
  });

  it('keeps its table roles when its rows become blocks', () => {
    expect(wrapper.find('table').attributes('role')).toBe('table');
    expect(wrapper.find('tbody th').attributes('role')).toBe('rowheader');
    expect(wrapper.find('tbody td').attributes('role')).toBe('cell');
  });
});
