/**
 * The start of a text, for a message: at most `maxChars` characters (UTF-16 units) followed by "…" when
 * the text was longer. A surrogate pair is never split. A column title may be thousands of characters
 * long; the message that names it must still fit the column that stores it.
 */
export function excerpt(text: string, maxChars = 40): string {
  if (text.length <= maxChars) return text;
  let end = maxChars;
  const last = text.charCodeAt(end - 1);
  if (last >= 0xd800 && last <= 0xdbff) end--;
  return `${text.slice(0, end)}…`;
}
