/** A download's file name from a capture's or comparison's name: ASCII letters, digits and dashes, then the suffix. */
export function exportFileName(name: string, suffix: string, fallback: string): string {
  const slug = name
    .normalize('NFKD')
    .replace(/[^\w.-]+/g, '-')
    .replace(/-{2,}/g, '-')
    .replace(/^[-.]+|[-.]+$/g, '')
    .slice(0, 80);
  return `${slug || fallback}-${suffix}`;
}
