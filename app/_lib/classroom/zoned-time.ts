// Assignment dates are entered and shown in the cohort's time zone (IANA), stored as instants.
// @date-fns/tz does the zone arithmetic (including daylight-saving changes).
import { TZDate } from "@date-fns/tz";

const LOCAL = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2})$/;

/** "2027-03-29T09:00" in `timeZone` → the instant; null when the text is not a local date-time. */
export function zonedLocalToInstant(local: string, timeZone: string): Date | null {
  const m = LOCAL.exec(local.trim());
  if (!m) return null;
  const [y, mo, d, h, mi] = m.slice(1).map(Number);
  if (mo < 1 || mo > 12 || d < 1 || d > 31 || h > 23 || mi > 59) return null;
  const t = new TZDate(y, mo - 1, d, h, mi, timeZone);
  // a day that does not exist in that month (31 April) rolls over: refuse it
  if (t.getDate() !== d || t.getMonth() !== mo - 1) return null;
  return new Date(t.getTime());
}

/** The instant as "YYYY-MM-DDTHH:mm" in `timeZone` (for a datetime-local field). */
export function instantToZonedLocal(instant: Date, timeZone: string): string {
  const t = new TZDate(instant.getTime(), timeZone);
  const p = (n: number) => String(n).padStart(2, "0");
  return `${t.getFullYear()}-${p(t.getMonth() + 1)}-${p(t.getDate())}T${p(t.getHours())}:${p(t.getMinutes())}`;
}

/** "Mon 29 Mar 2027, 09:00 IST" in the cohort's zone, for pages and e-mails. */
export function formatInZone(instant: Date | string, timeZone: string): string {
  return new Intl.DateTimeFormat("en-GB", { timeZone, weekday: "short", day: "numeric", month: "short", year: "numeric", hour: "2-digit", minute: "2-digit", timeZoneName: "short" }).format(new Date(instant));
}
