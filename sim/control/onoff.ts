/**
 * On/off control with a hysteresis band centred on SP (common practice; the convention is ours to
 * fix): reverse action switches on when PV < SP − H/2 and off when PV > SP + H/2, keeping its
 * state in between; direct action mirrors it (on above SP + H/2, off below SP − H/2).
 */
export class OnOffSwitch {
  on: boolean;

  constructor(
    private hysteresisC: number,
    private reverse: boolean,
    initiallyOn: boolean,
  ) {
    this.on = initiallyOn;
  }

  reconfigure(hysteresisC: number, reverse: boolean): void {
    this.hysteresisC = hysteresisC;
    this.reverse = reverse;
  }

  /** Update the relay state for this sample; returns whether it is on. */
  update(sp: number, pv: number): boolean {
    const half = this.hysteresisC / 2;
    if (this.reverse) {
      if (pv < sp - half) this.on = true;
      else if (pv > sp + half) this.on = false;
    } else {
      if (pv > sp + half) this.on = true;
      else if (pv < sp - half) this.on = false;
    }
    return this.on;
  }
}
