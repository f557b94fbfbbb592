/**
 * What the runner asks of a final element: the heater fraction (0–1 of the rating) on the
 * constant segment starting at t, and where that segment ends (a switching instant), so the
 * plant integration never crosses a switch.
 */
export interface DriveSegment {
  /** heater fraction of its rating on this segment, 0–1 */
  fraction: number;
  /** end of the constant segment (next possible switching instant), s; may be +∞ */
  until: number;
}

export interface HeaterDrive {
  /** the controller's OUT (%) from this sample on */
  setOutput(outPercent: number): void;
  /** the segment starting at time t (t is never earlier than the previous call) */
  segmentAt(t: number): DriveSegment;
}

/** Times closer than this are the same instant (guards float round-off of k·Ts against j·Tc). */
export const SAME_INSTANT_S = 1e-9;
