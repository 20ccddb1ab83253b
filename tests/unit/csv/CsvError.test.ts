/** Messages are stored with a failed capture and shown as they are, so they stay short whatever they quote. */
import { describe, expect, it } from 'vitest';
import { CsvError, MAX_MESSAGE_CHARS } from '../../../shared/csv';
import { excerpt } from '../../../shared/csv/excerpt';

describe('CsvError', () => {
  it('cuts a message quoting 70,000 characters to 500, ending in an ellipsis', () => {
    const e = new CsvError(`Channel ${'x'.repeat(70_000)}: no signal`, 3);
    expect(e.message).toBe(`Channel ${'x'.repeat(MAX_MESSAGE_CHARS - 9)}…`);
    expect(e.message.length).toBe(MAX_MESSAGE_CHARS);
    expect(e.line).toBe(3);
  });

  it('keeps a message of 500 characters as it is', () => {
    expect(new CsvError('m'.repeat(MAX_MESSAGE_CHARS)).message).toBe('m'.repeat(MAX_MESSAGE_CHARS));
  });
});

describe('excerpt', () => {
  it('keeps the first 40 characters of a longer text and adds an ellipsis', () => {
    expect(excerpt('a'.repeat(41))).toBe(`${'a'.repeat(40)}…`);
    expect(excerpt('a'.repeat(40))).toBe('a'.repeat(40));
  });

  it('never splits a surrogate pair', () => {
    expect(excerpt(`${'a'.repeat(39)}😀b`)).toBe(`${'a'.repeat(39)}…`);
  });
});
