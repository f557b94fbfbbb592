/**
 * The bytes of an uploaded log as text. Pure (TextDecoder exists in Node and in browsers), so the
 * new-twin page reads the file exactly as the server will.
 *
 * - A UTF-8 byte-order mark is stripped; UTF-16 with its BOM (what a spreadsheet's "Unicode text"
 *   export writes) is decoded as UTF-16.
 * - Invalid UTF-8 falls back to Windows-1252 instead of being refused: loggers and spreadsheet
 *   exports on Western-European Windows write "°C" as the single byte 0xB0, and the numbers
 *   themselves are ASCII in every such encoding, so a fallback only changes how a header reads.
 *   The encoding used is reported and stored with the upload's summary.
 * - NUL bytes in a file without a UTF-16 BOM mean a binary file (a workbook, an archive): refused.
 */
export type LogEncoding = "utf-8" | "utf-16le" | "utf-16be" | "windows-1252";

export type DecodedLog = { ok: true; text: string; encoding: LogEncoding } | { ok: false; message: string };

const NOT_TEXT = "This file is not text (it contains NUL bytes): export the log as CSV or tab-separated text and upload that.";

function utf16(bytes: Uint8Array, encoding: "utf-16le" | "utf-16be"): DecodedLog {
  const text = new TextDecoder(encoding).decode(bytes.subarray(2));
  // a NUL character is no more text in UTF-16 than in a byte file (and PostgreSQL cannot store it)
  return text.includes("\u0000") ? { ok: false, message: NOT_TEXT } : { ok: true, text, encoding };
}

export function decodeLogBytes(bytes: Uint8Array): DecodedLog {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return utf16(bytes, "utf-16le");
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return utf16(bytes, "utf-16be");
  if (bytes.includes(0)) return { ok: false, message: NOT_TEXT };
  const body = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? bytes.subarray(3) : bytes;
  try {
    return { ok: true, text: new TextDecoder("utf-8", { fatal: true }).decode(body), encoding: "utf-8" };
  } catch {
    return { ok: true, text: new TextDecoder("windows-1252").decode(body), encoding: "windows-1252" };
  }
}
