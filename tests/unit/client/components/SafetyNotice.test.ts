// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import SafetyNotice from '../../../../src/components/SafetyNotice.vue';
import { mountInApp } from '../harness';

afterEach(() => (document.body.innerHTML = ''));

describe('SafetyNotice', () => {
  it('in full: the cautions on category ratings, qualified persons and local codes', () => {
    const { wrapper } = mountInApp(SafetyNotice);
    const text = wrapper.text();
    expect(text).toMatch(/qualified persons/);
    expect(text).toMatch(/measurement category/);
    expect(text).toMatch(/local codes/);
    expect(wrapper.findAll('li')).toHaveLength(5);
  });

  it('compact: one line, with a button that opens the full cautions in place and says so', async () => {
    const { wrapper } = mountInApp(SafetyNotice, { props: { compact: true } });
    const toggle = wrapper.find('[data-test=safety-toggle]');
    const full = wrapper.find('[data-test=safety-full]');
    expect(wrapper.find('.line').text()).toMatch(/measurement category \(CAT II–IV\).*qualified person.*local codes/s);
    expect(toggle.attributes('aria-expanded')).toBe('false');
    expect(toggle.attributes('aria-controls')).toBe(full.attributes('id'));
    expect(full.isVisible()).toBe(false);
    await toggle.trigger('click');
    expect(toggle.attributes('aria-expanded')).toBe('true');
    expect(full.isVisible()).toBe(true);
    expect(full.findAll('li')).toHaveLength(5);
    expect(wrapper.find('a').attributes('href')).toBe('/help');
  });
});
