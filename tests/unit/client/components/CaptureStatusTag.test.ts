// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { CaptureStatus } from '../../../../shared/schemas/capture';
import CaptureStatusTag from '../../../../src/components/CaptureStatusTag.vue';
import { mountInApp } from '../harness';

afterEach(() => (document.body.innerHTML = ''));

describe('CaptureStatusTag', () => {
  it.each([...CaptureStatus.options, 'uploading' as const])('shows %s with a colour and an icon of its own', (status) => {
    const { wrapper } = mountInApp(CaptureStatusTag, { props: { status } });
    const tag = wrapper.find(`[data-test=status-${status}]`);
    expect(tag.text()).toBe(status);
    expect(tag.find('.pi').exists()).toBe(true);
  });
});
