"use client";
export const BENCH_SHORTCUTS: [string, string][] = [
  ["Space", "run / pause"],
  [".", "one sample step (paused)"],
  ["A", "toggle auto / manual"],
  ["↑ / ↓", "SP up / down by 0.5 °C (1 °F)"],
  ["Shift + ↑ / ↓", "manual OUT up / down by 1 %"],
  ["1 – 5", "speed ×1, ×10, ×60, ×600, max"],
  ["T", "show / hide the true temperature"],
  ["?", "this list"],
];

export function HelpOverlay({ onClose }: { onClose: () => void }) {
  return (
    <div className="fixed inset-0 z-50 flex items-center justify-center bg-ink/30" role="dialog" aria-modal="true" aria-labelledby="help-title" onClick={onClose}>
      <div className="w-96 rounded-sm border border-rule bg-paper-raised p-5 shadow-lg" onClick={(e) => e.stopPropagation()}>
        <h2 id="help-title" className="mb-3 text-sm font-semibold">
          Bench keyboard
        </h2>
        <dl className="grid grid-cols-[7rem_1fr] gap-y-1.5 text-sm">
          {BENCH_SHORTCUTS.map(([k, v]) => (
            <div key={k} className="contents">
              <dt>
                <kbd className="num rounded-sm border border-rule-strong bg-paper px-1.5 py-0.5 text-xs">{k}</kbd>
              </dt>
              <dd className="text-ink-soft">{v}</dd>
            </div>
          ))}
        </dl>
        <p className="mt-3 text-xs text-ink-faint">Shortcuts work when no entry field has the focus.</p>
        <button type="button" onClick={onClose} className="mt-4 rounded-sm border border-rule-strong px-3 py-1 text-sm hover:border-ink">
          Close
        </button>
      </div>
    </div>
  );
}
