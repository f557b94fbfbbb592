// A download header for a user's file name (RFC 6266 with RFC 8187's filename* for non-ASCII):
// an ASCII fallback with quotes and backslashes replaced, and the exact name percent-encoded.
export function attachmentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_") || "log.csv";
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/** The media type a log's name suggests; the bytes are sent as stored either way. */
export function logMediaType(fileName: string): string {
  if (/\.csv$/i.test(fileName)) return "text/csv";
  if (/\.(tsv|tab)$/i.test(fileName)) return "text/tab-separated-values";
  return "application/octet-stream";
}
