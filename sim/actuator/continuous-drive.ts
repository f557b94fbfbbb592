/** Continuous drive: heater fraction = OUT/100 clipped to 0–1, constant between samples. */
import type { DriveSegment, HeaterDrive } from "./heater-drive";

export class ContinuousDrive implements HeaterDrive {
  private out = 0;
  private readonly seg: DriveSegment = { fraction: 0, until: Infinity };
  setOutput(outPercent: number): void {
    this.out = outPercent;
  }
  segmentAt(_t: number): DriveSegment {
    this.seg.fraction = Math.min(1, Math.max(0, this.out / 100));
    this.seg.until = Infinity;
    return this.seg;
  }
}
