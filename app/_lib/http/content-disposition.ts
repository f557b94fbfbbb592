// Download headers and the file names that go into them: one place for every attachment route
// (the original log of a twin, a tuning record's PDF and traces, a cohort's standings).

// A download header for a file name (RFC 6266 with RFC 8187's filename* for non-ASCII):
// an ASCII fallback with quotes and backslashes replaced, and the exact name percent-encoded.
export function attachmentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_") || "log.csv";
  const encoded = encodeURIComponent(fileName).replace(/['()*]/g, (c) => `%${c.charCodeAt(0).toString(16).toUpperCase()}`);
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encoded}`;
}

/**
 * A file name's stem from a title: accents dropped (NFKD), lower-case ASCII letters and digits
 * joined by single dashes, at most 80 characters; `fallback` when nothing is left. Safe as is in
 * a quoted Content-Disposition parameter on every browser.
 */
export function fileNameSlug(title: string, fallback: string): string {
  const base = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 80);
  return base || fallback;
}

/** The media type a log's name suggests; the bytes are sent as stored either way. */
export function logMediaType(fileName: string): string {
  if (/\.csv$/i.test(fileName)) return "text/csv";
  if (/\.(tsv|tab)$/i.test(fileName)) return "text/tab-separated-values";
  return "application/octet-stream";
}
