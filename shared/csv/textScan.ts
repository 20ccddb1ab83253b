/**
 * Small scans by index for the head of a file. They replace regular expressions whose nested or adjacent
 * quantifiers backtracked on text a user controls (a title of "(" and 8,000 spaces took minutes).
 */

/** Whether a UTF-16 code is whitespace as the regular-expression class `\s` and String.trim() define it. */
export function isSpace(code: number): boolean {
  return (
    code === 32 ||
    (code >= 9 && code <= 13) ||
    code === 0xa0 ||
    code === 0x1680 ||
    (code >= 0x2000 && code <= 0x200a) ||
    code === 0x2028 ||
    code === 0x2029 ||
    code === 0x202f ||
    code === 0x205f ||
    code === 0x3000 ||
    code === 0xfeff
  );
}

/** The text without its first and last character when the first is one of `openers` and the last one of `closers`. */
export function unwrap(text: string, openers: string, closers: string): string {
  const n = text.length;
  return n >= 2 && openers.includes(text[0]) && closers.includes(text[n - 1]) ? text.slice(1, -1) : text;
}

/** The mark among `marks` that the text starts with after any whitespace, and where the text after it begins. */
export function leadingMark(text: string, marks: readonly string[]): { mark: string; end: number } | null {
  let i = 0;
  while (i < text.length && isSpace(text.charCodeAt(i))) i++;
  const mark = marks.find((m) => text.startsWith(m, i));
  return mark === undefined ? null : { mark, end: i + mark.length };
}
