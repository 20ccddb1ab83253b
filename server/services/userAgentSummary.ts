/** Browser and system names, first match wins: Edge and Opera also say "Chrome", Chrome also says "Safari". */
const BROWSERS: [marker: string, name: string][] = [
  ['Edg/', 'Edge'],
  ['OPR/', 'Opera'],
  ['Firefox/', 'Firefox'],
  ['Chromium/', 'Chromium'],
  ['Chrome/', 'Chrome'],
  ['Safari/', 'Safari'],
  ['curl/', 'curl'],
];
const SYSTEMS: [marker: string, name: string][] = [
  ['Android', 'Android'],
  ['iPhone', 'iOS'],
  ['iPad', 'iPadOS'],
  ['Windows', 'Windows'],
  ['Mac OS X', 'macOS'],
  ['CrOS', 'ChromeOS'],
  ['Linux', 'Linux'],
];

/**
 * A short name for a User-Agent header ("Firefox on Linux"), for the list of a person's sessions. Plain
 * substring checks on a bounded prefix: the header is chosen by the client.
 */
export function userAgentSummary(header: string | undefined): string {
  const ua = (header ?? '').slice(0, 512);
  if (!ua.trim()) return 'Unknown browser';
  const browser = BROWSERS.find(([m]) => ua.includes(m))?.[1];
  const system = SYSTEMS.find(([m]) => ua.includes(m))?.[1];
  if (browser && system) return `${browser} on ${system}`;
  return (browser ?? system ?? ua).slice(0, 120);
}
