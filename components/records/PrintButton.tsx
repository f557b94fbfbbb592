"use client";

/** Opens the browser's print dialogue; the print stylesheet leaves only the document. */
export function PrintButton() {
  return (
    <button type="button" onClick={() => window.print()} className="rounded-sm border border-rule-strong bg-paper-raised px-3 py-1.5 text-sm hover:border-ink">
      Print
    </button>
  );
}
