// Errors that may reach a client. Anything else is logged and answered with a generic message.
export type ErrorCode =
  | "unauthorized"
  | "forbidden"
  | "not_found"
  | "invalid_input"
  | "conflict"
  | "rate_limited"
  | "invalid_file"
  | "file_too_large"
  | "unsupported_file"
  | "unavailable"
  | "internal";

const STATUS: Record<ErrorCode, number> = {
  unauthorized: 401,
  forbidden: 403,
  not_found: 404,
  invalid_input: 400,
  conflict: 409,
  rate_limited: 429,
  invalid_file: 400,
  file_too_large: 413,
  unsupported_file: 415,
  unavailable: 503,
  internal: 500,
};

export class AppError extends Error {
  readonly code: ErrorCode;
  readonly status: number;
  readonly details: Record<string, unknown> | undefined;
  constructor(code: ErrorCode, message: string, details?: Record<string, unknown>, status?: number) {
    super(message);
    this.name = "AppError";
    this.code = code;
    this.status = status ?? STATUS[code];
    this.details = details;
  }
}

export const unauthorized = () => new AppError("unauthorized", "Sign in first, or send a valid API token.");
export const forbidden = (what: string) => new AppError("forbidden", `Your role may not ${what}.`);
export const notFound = (what: string) => new AppError("not_found", `${what} was not found.`);

/** zod issues → { field: message } so forms and API clients can point at the bad field. */
export function fieldErrors(issues: readonly { path: readonly PropertyKey[]; message: string }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const issue of issues) {
    const key = issue.path.map(String).join(".") || "_";
    if (!out[key]) out[key] = issue.message;
  }
  return out;
}

export function invalidInput(issues: readonly { path: readonly PropertyKey[]; message: string }[]): AppError {
  const fields = fieldErrors(issues);
  const names = Object.keys(fields);
  const message =
    names.length === 1 ? `${names[0]}: ${fields[names[0]]}` : `${names.length} fields need attention: ${names.join(", ")}.`;
  return new AppError("invalid_input", message, { fields });
}

/** SQLite constraint failures → our codes, so a duplicate tag is a 409 and not a 500. */
export function fromDbError(err: unknown, uniqueMessage: (constraint: string) => string): AppError | null {
  const text = String((err as { message?: string })?.message ?? err) + String((err as { cause?: { message?: string } })?.cause?.message ?? "");
  const unique = /UNIQUE constraint failed: ([\w.,\s]+)/.exec(text);
  if (unique) return new AppError("conflict", uniqueMessage(unique[1].trim()));
  if (/FOREIGN KEY constraint failed/.test(text)) return new AppError("invalid_input", "A referenced record does not exist.");
  return null;
}
