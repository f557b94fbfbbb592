import { controllerConfigSchema, type ControllerConfigInput, ControllerBlock, type ControllerMode } from "../../../sim/control";

export function cfg(over: ControllerConfigInput = {}) {
  return controllerConfigSchema.parse(over);
}

export function block(over: ControllerConfigInput, init: { out?: number; mode?: ControllerMode; sp?: number; pv?: number } = {}) {
  return new ControllerBlock(cfg(over), { out: init.out ?? 0, mode: init.mode ?? "auto", sp: init.sp ?? 0, pv: init.pv ?? 0 });
}

/** Exact zero-order-hold step of a first-order plant K/(τs+1): y ← a·y + K(1 − a)·u, a = e^(−h/τ). */
export function firstOrderPlant(gain: number, tau: number, h: number, y0 = 0) {
  const a = Math.exp(-h / tau);
  let y = y0;
  return {
    get y() {
      return y;
    },
    step(u: number) {
      y = a * y + gain * (1 - a) * u;
      return y;
    },
  };
}
