/** The persistent caution every page carries. */
export function SafetyFooter() {
  return (
    <footer className="border-t border-rule bg-paper-sunk px-6 py-3 text-xs text-ink-soft" role="contentinfo">
      <p>
        <strong className="font-medium text-caution">Training simulator.</strong> Results here are from a model, not your equipment.
        Real heater loops need an independent, manually reset excess-temperature cutout; mains wiring and heater work follow local
        codes and are done by licensed people.
      </p>
    </footer>
  );
}
