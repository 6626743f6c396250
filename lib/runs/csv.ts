/**
 * CSV cells for spreadsheets. A cell that begins with =, +, - or @ (or a tab or carriage return)
 * would be read as a formula, so it gets a leading apostrophe (OWASP "CSV injection").
 * Numbers are written as numbers; a negative number is data, not a formula, and stays as it is.
 */
export function csvCell(value: unknown): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "number") return Number.isFinite(value) ? String(value) : "";
  let s = value instanceof Date ? value.toISOString() : String(value);
  if (/^[=+\-@\t\r]/.test(s)) s = `'${s}`;
  return /[",\n\r]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

export function csvLine(values: unknown[]): string {
  return values.map(csvCell).join(",");
}
