/**
 * The one error type the thermal module throws for anything wrong with a logger file
 * (or with the options used to read it). Route handlers map it straight to an API error:
 * `{ error: { code, message, details } }` with `status` as the HTTP status.
 */
export type ThermalErrorCode =
  | "invalid_file"
  | "unsupported_file"
  | "file_too_large"
  | "invalid_options";

export type ThermalErrorDetails = Record<string, string | number | boolean | null>;

// A registry-wide brand: bundlers and loaders may evaluate this module twice (ESM and CJS copies),
// and a plain `instanceof` would then miss errors made by the other copy.
const BRAND = Symbol.for("ovenward.thermal.ThermalFileError");

export class ThermalFileError extends Error {
  static [Symbol.hasInstance](value: unknown): boolean {
    return typeof value === "object" && value !== null && (value as Record<symbol, unknown>)[BRAND] === true;
  }

  readonly [BRAND] = true;
  readonly code: ThermalErrorCode;
  readonly status: number;
  readonly details: ThermalErrorDetails;

  constructor(code: ThermalErrorCode, message: string, status: number, details: ThermalErrorDetails = {}) {
    super(message);
    this.name = "ThermalFileError";
    this.code = code;
    this.status = status;
    this.details = details;
  }
}

/** 400 invalid_file: the file was read but its content cannot be analysed. */
export function invalidFile(message: string, details: ThermalErrorDetails = {}): ThermalFileError {
  return new ThermalFileError("invalid_file", message, 400, details);
}

/** 400 invalid_options: an analysis option is wrong; `details.field` names it. */
export function invalidOptions(field: string, message: string): ThermalFileError {
  return new ThermalFileError("invalid_options", message, 400, { field });
}

export function isThermalFileError(error: unknown): error is ThermalFileError {
  return error instanceof ThermalFileError;
}
