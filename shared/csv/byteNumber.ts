/**
 * Decimal numbers read straight from the bytes of an ASCII-compatible text (UTF-8, Windows-1252, or
 * UTF-16 transcoded to UTF-8), with no string per cell.
 *
 * Correct rounding: the digits are gathered into an integer significand s and a decimal exponent e.
 * When s < 2^53 and |e| ≤ 22, both s and 10^|e| are exact doubles, so the one multiplication or division
 * s·10^e is correctly rounded by IEEE 754 itself (W. D. Clinger, "How to read floating point numbers
 * accurately", PLDI 1990: the fast path). Anything else (17+ significant digits, huge exponents,
 * subnormals) is handed to `Number()`, which rounds correctly in every case; it is rare in instrument
 * exports, which print 4 to 12 significant digits.
 */

/** 10^0 … 10^22: every one an exact double. */
const POW10 = Array.from({ length: 23 }, (_, i) => Number(`1e${i}`));
/** Digits are accumulated while the significand stays below this, so s·10 + 9 < 2^53. */
const SIGNIFICAND_ROOM = Math.floor((2 ** 53 - 9) / 10);

/** A number read by `readByteNumber`: its value and where it ended. */
export interface ByteNumber {
  value: number;
  /** Index just after the number's last byte. */
  end: number;
}

const latin1 = new TextDecoder('latin1');

/**
 * Reads a plain decimal number (optional sign, digits with one decimal mark, optional exponent) from
 * `bytes[from, to)` into `out`, and returns true; returns false (out untouched) when there is none there:
 * an empty cell, a marker such as NaN or OL, text, or a number of more than 40 bytes. The number ends at
 * the first byte that cannot continue it; the caller checks what follows (a delimiter, a line end).
 *
 * @param decimalMark the byte of the decimal mark: 46 for '.', 44 for ','
 */
export function readByteNumber(bytes: Uint8Array, from: number, to: number, decimalMark: number, out: ByteNumber): boolean {
  let i = from;
  let negative = false;
  let b = i < to ? bytes[i] : -1;
  if (b === 45 || b === 43) {
    negative = b === 45;
    b = ++i < to ? bytes[i] : -1;
  }
  let significand = 0;
  let exponent = 0;
  let digits = 0;
  let exact = true;
  while (b >= 48 && b <= 57) {
    if (significand < SIGNIFICAND_ROOM) significand = significand * 10 + (b - 48);
    else {
      exact = false;
      exponent++;
    }
    digits++;
    b = ++i < to ? bytes[i] : -1;
  }
  if (b === decimalMark) {
    b = ++i < to ? bytes[i] : -1;
    while (b >= 48 && b <= 57) {
      if (significand < SIGNIFICAND_ROOM) {
        significand = significand * 10 + (b - 48);
        exponent--;
      } else if (b !== 48) exact = false;
      digits++;
      b = ++i < to ? bytes[i] : -1;
    }
  }
  if (digits === 0) return false;
  if (b === 101 || b === 69) {
    let j = i + 1;
    let e = j < to ? bytes[j] : -1;
    let expNegative = false;
    if (e === 45 || e === 43) {
      expNegative = e === 45;
      e = ++j < to ? bytes[j] : -1;
    }
    let written = 0;
    let expDigits = 0;
    while (e >= 48 && e <= 57) {
      if (expDigits < 6) written = written * 10 + (e - 48);
      expDigits++;
      e = ++j < to ? bytes[j] : -1;
    }
    if (expDigits === 0) return false;
    // Six or more exponent digits (with leading zeros, perhaps): left to Number() rather than capped.
    if (expDigits >= 6) exact = false;
    exponent += expNegative ? -written : written;
    i = j;
  }
  if (i - from > 40) return false;
  if (exact && exponent >= -22 && exponent <= 22) {
    const magnitude = exponent >= 0 ? significand * POW10[exponent] : significand / POW10[-exponent];
    out.value = negative ? -magnitude : magnitude;
  } else {
    // The slow, always correct path: the cell's own text through Number().
    let text = latin1.decode(bytes.subarray(from, i));
    if (decimalMark === 44) text = text.replace(',', '.');
    out.value = Number(text);
  }
  out.end = i;
  return true;
}
