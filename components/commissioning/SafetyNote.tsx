/** The caution every pre-commissioning screen carries: a tuning proven on a model is not yet proven on the heater. */
export function SafetyNote() {
  return (
    <div role="note" aria-label="Before the real heater" className="rounded-sm border border-caution/50 bg-caution-soft px-3 py-2 text-xs text-ink">
      <p className="font-semibold text-caution">This tuning is proven on a model, not on the real heater.</p>
      <p>
        Before applying it to the equipment, follow your local electrical codes and licensed practice for work on heaters and mains supplies, check the
        excess-temperature cutout independently of the controller, and be present at the first run, ready to switch the heater off.
      </p>
    </div>
  );
}
