/**
 * Strict decimal number reading for logger cells: optional sign, digits, one decimal separator
 * (point or comma, chosen per file), optional exponent, surrounding spaces. Anything else
 * (units, hex, "NaN", thousands separators, empty) is NaN. Faster than Number() plus a regex, and
 * exactly as precise: a mantissa of at most 15 digits divided by an exact power of ten is one
 * correctly rounded operation; longer forms fall back to Number().
 */
const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16];

export function parseDecimal(s: string, decimalComma: boolean): number {
  // Fast path for the usual cell: optional minus, digits, at most one separator, nothing else.
  const n = s.length;
  let i = 0;
  let negative = false;
  if (s.charCodeAt(0) === 45) { negative = true; i = 1; }
  const sep = decimalComma ? 44 : 46;
  let mantissa = 0;
  let digits = 0;
  let point = -1;
  for (; i < n; i++) {
    const c = s.charCodeAt(i);
    const d = c - 48;
    if (d >= 0 && d <= 9) { mantissa = mantissa * 10 + d; digits++; }
    else if (c === sep && point < 0) point = i;
    else return parseGeneral(s, decimalComma);
  }
  if (digits === 0 || digits > 15) return parseGeneral(s, decimalComma);
  const fraction = point < 0 ? 0 : n - 1 - point;
  const value = fraction === 0 ? mantissa : mantissa / POW10[fraction];
  return negative ? -value : value;
}

/** The full grammar: spaces, "+", exponent, long mantissas. */
function parseGeneral(s: string, decimalComma: boolean): number {
  const n = s.length;
  let i = 0;
  while (i < n && s.charCodeAt(i) === 32) i++;
  let end = n;
  while (end > i && s.charCodeAt(end - 1) === 32) end--;
  if (i >= end) return NaN;
  let c = s.charCodeAt(i);
  let negative = false;
  if (c === 45) { negative = true; i++; } else if (c === 43) i++;
  const sep = decimalComma ? 44 : 46;
  let mantissa = 0;
  let digits = 0;
  let fraction = 0;
  let any = false;
  while (i < end) {
    c = s.charCodeAt(i);
    if (c < 48 || c > 57) break;
    mantissa = mantissa * 10 + (c - 48);
    digits++;
    any = true;
    i++;
  }
  if (i < end && s.charCodeAt(i) === sep) {
    i++;
    while (i < end) {
      c = s.charCodeAt(i);
      if (c < 48 || c > 57) break;
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      fraction++;
      any = true;
      i++;
    }
  }
  if (!any) return NaN;
  if (i < end) {
    c = s.charCodeAt(i);
    if (c !== 101 && c !== 69) return NaN;
    i++;
    if (i < end && (s.charCodeAt(i) === 43 || s.charCodeAt(i) === 45)) i++;
    const expStart = i;
    while (i < end && s.charCodeAt(i) >= 48 && s.charCodeAt(i) <= 57) i++;
    if (i === expStart || i !== end) return NaN;
    return slowPath(s, decimalComma);
  }
  if (digits > 15) return slowPath(s, decimalComma);
  const value = fraction === 0 ? mantissa : mantissa / POW10[fraction];
  return negative ? -value : value;
}

function slowPath(s: string, decimalComma: boolean): number {
  const value = Number(decimalComma ? s.replace(",", ".") : s);
  return Number.isFinite(value) ? value : NaN;
}
