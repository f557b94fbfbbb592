/**
 * Analog input: an N-bit converter over [rangeLowMa, rangeHighMa].
 * Mid-tread uniform quantiser with 2ᴺ codes, code 0 at rangeLowMa and code 2ᴺ − 1 at rangeHighMa,
 * so the step is span / (2ᴺ − 1) and the reconstruction error is at most half a step; inputs
 * outside the range saturate at the end codes (common practice for AI cards).
 */

/** Current per code step, mA: span / (2ᴺ − 1). */
export function adcStepMa(bits: number, rangeLowMa: number, rangeHighMa: number): number {
  return (rangeHighMa - rangeLowMa) / (2 ** bits - 1);
}

/** ADC code for a current (rounded to nearest, saturating). */
export function adcCode(mA: number, bits: number, rangeLowMa: number, rangeHighMa: number): number {
  const maxCode = 2 ** bits - 1;
  const code = Math.round((mA - rangeLowMa) / adcStepMa(bits, rangeLowMa, rangeHighMa));
  return code < 0 ? 0 : code > maxCode ? maxCode : code;
}

/** Precomputed quantiser for the hot path: quantize() returns the reconstructed current. */
export class AnalogInput {
  readonly stepMa: number;
  private readonly maxCode: number;

  constructor(
    readonly bits: number,
    readonly rangeLowMa: number,
    readonly rangeHighMa: number,
  ) {
    this.maxCode = 2 ** bits - 1;
    this.stepMa = (rangeHighMa - rangeLowMa) / this.maxCode;
  }

  /** Code of a current: round((I − lo)/step), saturated to [0, 2ᴺ − 1]. */
  code(mA: number): number {
    const c = Math.round((mA - this.rangeLowMa) / this.stepMa);
    return c < 0 ? 0 : c > this.maxCode ? this.maxCode : c;
  }

  /** The current the input reports: lo + code · step. */
  quantize(mA: number): number {
    return this.rangeLowMa + this.code(mA) * this.stepMa;
  }
}
