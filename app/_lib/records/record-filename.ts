// A download's file name from the record's title: ASCII letters, digits and dashes only, so it is
// safe inside a quoted Content-Disposition parameter on every browser.
export function recordFileName(title: string, suffix: string, ext: string): string {
  const base = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-|-$/g, "")
    .slice(0, 80);
  return `${base || "tuning-record"}${suffix}.${ext}`;
}
