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

export function decodeLogBytes(bytes: Uint8Array): DecodedLog {
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe) return { ok: true, text: new TextDecoder("utf-16le").decode(bytes.subarray(2)), encoding: "utf-16le" };
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff) return { ok: true, text: new TextDecoder("utf-16be").decode(bytes.subarray(2)), encoding: "utf-16be" };
  if (bytes.includes(0)) {
    return { ok: false, message: "This file is not text (it contains NUL bytes): export the log as CSV or tab-separated text and upload that." };
  }
  const body = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? bytes.subarray(3) : bytes;
  try {
    return { ok: true, text: new TextDecoder("utf-8", { fatal: true }).decode(body), encoding: "utf-8" };
  } catch {
    return { ok: true, text: new TextDecoder("windows-1252").decode(body), encoding: "windows-1252" };
  }
}
