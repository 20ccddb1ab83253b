const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);
const latin1 = new TextDecoder('latin1');

/** Whether bytes [s, e) hold only spaces and tabs. */
export function isBlank(b: Uint8Array, s: number, e: number): boolean {
  for (let i = s; i < e; i++) if (b[i] !== 32 && b[i] !== 9) return false;
  return true;
}

/**
 * A decimal number read from bytes [s, e) of an ASCII .dat, spaces around it allowed; NaN when the
 * field is empty or not a number (the caller tells the two apart with `isBlank`).
 *
 * No string is made for a number: the digits are kept as an integer significand and a decimal exponent,
 * and when the significand is below 2^53 and the exponent within ±22 one multiplication or division by
 * an exact power of ten gives the correctly rounded value (the classic exact fast path; TOOLCHAIN.md
 * notes the same measure for the CSV reader). Anything longer falls back to Number() on the text.
 */
export function asciiNumber(b: Uint8Array, s: number, e: number): number {
  while (s < e && (b[s] === 32 || b[s] === 9)) s++;
  while (e > s && (b[e - 1] === 32 || b[e - 1] === 9)) e--;
  let i = s;
  let negative = false;
  if (b[i] === 45 || b[i] === 43) negative = b[i++] === 45;
  let significand = 0;
  let digits = 0;
  let scale = 0;
  while (i < e && b[i] >= 48 && b[i] <= 57) {
    significand = significand * 10 + (b[i++] - 48);
    digits++;
  }
  if (i < e && b[i] === 46) {
    i++;
    while (i < e && b[i] >= 48 && b[i] <= 57) {
      significand = significand * 10 + (b[i++] - 48);
      digits++;
      scale--;
    }
  }
  if (digits === 0) return NaN;
  if (i < e && (b[i] === 69 || b[i] === 101)) {
    i++;
    let expNegative = false;
    if (b[i] === 45 || b[i] === 43) expNegative = b[i++] === 45;
    let exponent = 0;
    const from = i;
    while (i < e && b[i] >= 48 && b[i] <= 57 && i - from < 6) exponent = exponent * 10 + (b[i++] - 48);
    if (i === from) return NaN;
    scale += expNegative ? -exponent : exponent;
  }
  if (i !== e) return NaN;
  if (significand > 2 ** 53 || scale < -22 || scale > 22) return Number(latin1.decode(b.subarray(s, e)));
  const v = scale >= 0 ? significand * POW10[scale] : significand / POW10[-scale];
  return negative ? -v : v;
}
