import { fileNameSlug } from "@/app/_lib/http/content-disposition";

// A download's file name from the record's title (see fileNameSlug: ASCII letters, digits and
// dashes only).
export function recordFileName(title: string, suffix: string, ext: string): string {
  return `${fileNameSlug(title, "tuning-record")}${suffix}.${ext}`;
}
