/*
 * A spreadsheet runs a cell that starts with = + - @ (or a tab / carriage return before one) as a
 * formula. Exported text is prefixed with an apostrophe so it stays text (OWASP "CSV Injection").
 * Plain numbers such as -3 are left alone: they are numbers, not formulas.
 */
export function neutraliseCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  const text = String(value);
  if (typeof value === "number") return text;
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}
