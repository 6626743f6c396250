import { invalidFile, ThermalFileError } from "./errors";

/** Largest logger file accepted: 20 MB (MiB). */
export const MAX_FILE_BYTES = 20 * 1024 * 1024;

export type LoggerFileInput = { bytes: Uint8Array } | { text: string };

const sizeMessage = (bytes: number) =>
  `The file is ${(bytes / 1024 / 1024).toFixed(1)} MB; the largest file accepted is 20 MB. ` +
  "Export a shorter recording, or fewer probes, and upload it again.";

function tooLarge(bytes: number): ThermalFileError {
  return new ThermalFileError("file_too_large", sizeMessage(bytes), 413, { bytes, limit: MAX_FILE_BYTES });
}

function unsupported(message: string, details: Record<string, string | number> = {}): ThermalFileError {
  return new ThermalFileError("unsupported_file", message, 415, details);
}

function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff) { bytes += 4; i++; }
    else bytes += 3;
  }
  return bytes;
}

const utf8 = new TextDecoder("utf-8", { fatal: true, ignoreBOM: true });

/**
 * Turns the upload into text and refuses what is not a text table: over 20 MB (413), NUL bytes,
 * invalid UTF-8 or many control characters (415), nothing but whitespace (400). Strips a BOM.
 */
export function decodeLoggerFile(input: LoggerFileInput): string {
  let text: string;
  if ("bytes" in input) {
    const bytes = input.bytes;
    if (!(bytes instanceof Uint8Array)) throw invalidFile("The upload holds no file data. Choose a logger file and upload it again.");
    if (bytes.length > MAX_FILE_BYTES) throw tooLarge(bytes.length);
    const utf16 = bytes.length >= 2 && ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff));
    if (utf16) {
      throw unsupported("The file is UTF-16 (\"Unicode text\"). Save it as CSV (UTF-8) or plain text and upload it again.");
    }
    if (bytes.indexOf(0) !== -1) {
      throw unsupported("The file holds binary data (NUL bytes), not a text table. Export the logger data as CSV or text and upload that.");
    }
    try {
      text = utf8.decode(bytes);
    } catch {
      throw unsupported("The file is not valid UTF-8 text. Save or export it as CSV (UTF-8) and upload it again.");
    }
  } else {
    if (typeof input.text !== "string") throw invalidFile("The upload holds no file text. Choose a logger file and upload it again.");
    text = input.text;
    if (text.length > MAX_FILE_BYTES || (text.length * 3 > MAX_FILE_BYTES && utf8Length(text) > MAX_FILE_BYTES)) {
      throw tooLarge(utf8Length(text));
    }
    if (text.indexOf("\0") !== -1) {
      throw unsupported("The file holds binary data (NUL characters), not a text table. Export the logger data as CSV or text and upload that.");
    }
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  checkTextLooksLikeTable(text);
  return text;
}

// Control characters other than tab, LF, CR, plus the replacement character left by a lossy decode.
const SUSPICIOUS = /[\x01-\x08\x0b\x0c\x0e-\x1f\x7f\ufffd]/g;

// Like other binary sniffers, judge by the start of the file: a binary or mis-encoded file shows
// it at once, and a stray control character deeper in would fail as a non-numeric cell anyway.
const SNIFF_CHARS = 65536;

function checkTextLooksLikeTable(text: string): void {
  if (text.trim().length === 0) {
    throw invalidFile("The file is empty. Upload the logger's export: a header row, then one row per sample.");
  }
  const head = text.length > SNIFF_CHARS ? text.slice(0, SNIFF_CHARS) : text;
  SUSPICIOUS.lastIndex = 0;
  if (!SUSPICIOUS.test(head)) return;
  const count = head.match(SUSPICIOUS)?.length ?? 0;
  // A stray control character can survive a copy/paste; many of them mean binary or mis-encoded data.
  if (count > 8 && count > head.length / 1000) {
    throw unsupported(
      `The file holds ${count} control or unreadable characters, so it is not a plain text table. ` +
        "Export the logger data as CSV (UTF-8) and upload that.",
      { controlCharacters: count },
    );
  }
}
