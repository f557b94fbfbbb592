/**
 * Strict reading of one numeric cell with a chosen decimal mark. Strict on purpose: a log cell
 * that is not plainly a number ("12.5.3", "12,4x", "", "1e400") is a sign of a wrong column or a
 * wrong decimal mark, and guessing would hide it.
 *
 * Kept simple: no thousands separators at all (with decimal mark "," a "1.234,5" is refused, with
 * "." a "1,234.5" is refused); logger values in a bump test never need them. Exponents ("1.5e-3")
 * are accepted because some loggers write them. A leading "+" or "-" (and the Unicode minus "−"
 * that spreadsheets export) is accepted.
 */
export type DecimalMark = "." | ",";

const DOT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const COMMA = /^[+-]?(?:\d+(?:,\d*)?|,\d+)(?:[eE][+-]?\d+)?$/;

/** The number in `cell`, or null when the cell is not a finite number written with `decimalMark`. */
export function parseNumber(cell: string, decimalMark: DecimalMark): number | null {
  const s = cell.trim().replace(/^\u2212/, "-");
  if (s === "" || s.length > 64) return null;
  if (!(decimalMark === "," ? COMMA : DOT).test(s)) return null;
  const v = Number(decimalMark === "," ? s.replace(",", ".") : s);
  return Number.isFinite(v) ? v : null;
}

/** Whether a cell reads as a number with this decimal mark (for guessing the mark). */
export function isNumberCell(cell: string, decimalMark: DecimalMark): boolean {
  return parseNumber(cell, decimalMark) !== null;
}
