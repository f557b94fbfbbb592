// Text for the PDF's standard Helvetica, which pdfkit encodes as WinAnsi (Windows-1252): symbols
// the record's own figures avoid are spelled out; anything else outside the code page becomes "?"
// rather than a wrong glyph (the user's notes and titles may hold any character).
const SPELLED: Record<string, string> = {
  "−": "-",
  "→": "->",
  "←": "<-",
  "≤": "<=",
  "≥": ">=",
  "≈": "~",
  "∞": "inf",
  "τ": "tau",
  "θ": "theta",
  "ω": "omega",
  "Δ": "delta",
  "√": "sqrt",
  "\u00a0": " ",
  "\u2009": " ",
  "\u202f": " ",
};

// the 0x80–0x9F block of Windows-1252 (the rest of the code page is ASCII and Latin-1)
const CP1252_EXTRA = new Set("€‚ƒ„…†‡ˆ‰Š‹ŒŽ‘’“”•–—˜™š›œžŸ");

export function pdfText(s: string): string {
  let out = "";
  for (const ch of s) {
    const code = ch.codePointAt(0)!;
    if (ch === "\n" || (code >= 0x20 && code <= 0x7e) || (code >= 0xa1 && code <= 0xff) || CP1252_EXTRA.has(ch)) out += ch;
    else if (SPELLED[ch] !== undefined) out += SPELLED[ch];
    else if (ch === "\t") out += "  ";
    else if (code >= 0x20) out += "?";
  }
  return out;
}
