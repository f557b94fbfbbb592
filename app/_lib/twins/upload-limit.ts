// The size limit as the technician reads it, the same words in the browser (before the file is
// read) and on the server (before the bytes are looked at).
import { MAX_UPLOAD_BYTES } from "@/sim/import";

const megabytes = (n: number) => String(+(n / (1024 * 1024)).toFixed(1));

export const LIMIT_TEXT = `${megabytes(MAX_UPLOAD_BYTES)} MiB (${MAX_UPLOAD_BYTES.toLocaleString("en-GB")} bytes)`;

export const sizeLimitMessage = (byteSize: number) => `The file is ${megabytes(byteSize)} MiB; the limit is ${LIMIT_TEXT}. Trim the log to the bump test.`;
