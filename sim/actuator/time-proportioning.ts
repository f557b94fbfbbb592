/**
 * Time-proportioning output to a solid-state relay (common practice). Cycles start at j·T_c from
 * t = 0. At the start of each cycle the duty d = OUT/100 (clipped to 0–1) is latched and the
 * relay is on for one pulse at the start of the cycle.
 *
 * Carry-over rule (so short pulses are not lost and the average power equals the demand):
 *   requested = d·T_c + carry
 *   if requested < minOn:                 on = 0,    carry = requested        (pulse owed to the next cycle)
 *   else if T_c − requested < minOff:     on = T_c,  carry = requested − T_c  (excess paid back next cycle)
 *   else:                                 on = requested, carry = 0
 * carry is then clipped to [−minOff, minOn], so a stale remainder never outlives a change of
 * demand by more than one minimum pulse.
 */
import { SAME_INSTANT_S, type DriveSegment, type HeaterDrive } from "./heater-drive";

export interface TimeProportioningConfig {
  cycleTimeS: number;
  minOnTimeS: number;
  minOffTimeS: number;
}

export interface CyclePulse {
  onTimeS: number;
  carryS: number;
}

/** One cycle of the carry-over rule (header). */
export function cyclePulse(duty: number, carryS: number, cfg: TimeProportioningConfig): CyclePulse {
  const tc = cfg.cycleTimeS;
  const d = Math.min(1, Math.max(0, duty));
  const requested = d * tc + carryS;
  let on: number;
  let carry: number;
  if (requested < cfg.minOnTimeS || requested <= 0) {
    on = 0;
    carry = requested;
  } else if (tc - requested < cfg.minOffTimeS || requested >= tc) {
    on = tc;
    carry = requested - tc;
  } else {
    on = requested;
    carry = 0;
  }
  carry = Math.min(cfg.minOnTimeS, Math.max(-cfg.minOffTimeS, carry));
  return { onTimeS: on, carryS: carry };
}

export class TimeProportioningDrive implements HeaterDrive {
  private out = 0;
  private cycle = -1;
  private onEnd = 0;
  private carry = 0;
  private readonly seg: DriveSegment = { fraction: 0, until: 0 };
  /** pulses issued, for tests and the trend */
  pulses = 0;

  constructor(readonly cfg: TimeProportioningConfig) {}

  setOutput(outPercent: number): void {
    this.out = outPercent;
  }

  private cycleStart(j: number): number {
    return j * this.cfg.cycleTimeS;
  }

  segmentAt(t: number): DriveSegment {
    // start every cycle whose start is due (normally one)
    while (this.cycleStart(this.cycle + 1) <= t + SAME_INSTANT_S) {
      this.cycle++;
      const p = cyclePulse(this.out / 100, this.carry, this.cfg);
      this.carry = p.carryS;
      this.onEnd = this.cycleStart(this.cycle) + p.onTimeS;
      if (p.onTimeS > 0) this.pulses++;
    }
    const next = this.cycleStart(this.cycle + 1);
    if (t < this.onEnd - SAME_INSTANT_S) {
      this.seg.fraction = 1;
      this.seg.until = Math.min(this.onEnd, next);
    } else {
      this.seg.fraction = 0;
      this.seg.until = next;
    }
    return this.seg;
  }

  /** Switching instants of the current cycle: its start, the end of its pulse (if inside), the next start. */
  switchingInstants(): number[] {
    const start = this.cycleStart(this.cycle);
    const next = this.cycleStart(this.cycle + 1);
    return this.onEnd > start && this.onEnd < next ? [start, this.onEnd, next] : [start, next];
  }

  /** carry held for the next cycle, s */
  get carryS(): number {
    return this.carry;
  }
}
