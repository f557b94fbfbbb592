// The size limit as the technician reads it, the same words in the browser (before the file is
// read) and on the server (before the bytes are looked at).
import { MAX_UPLOAD_BYTES, mebibytesText } from "@/sim/import";

export const LIMIT_TEXT = `${mebibytesText(MAX_UPLOAD_BYTES)} MiB (${MAX_UPLOAD_BYTES.toLocaleString("en-GB")} bytes)`;

export const sizeLimitMessage = (byteSize: number) => `The file is ${mebibytesText(byteSize)} MiB; the limit is ${LIMIT_TEXT}. Trim the log to the bump test.`;
