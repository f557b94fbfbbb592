// Robustness margins of the record's tuning on its model, with every lag the loop adds that the
// toolkit's loop supports (sim/tuning/robustness/loop.ts): the PV filter, the sensor element when
// the model leaves it out (a twin's sensorTimeConstantS), half a controller sample and half a
// heater cycle. Infinite margins (no crossover) are stored as null: JSON has no Infinity.
import type { DriveConfig } from "@/sim/actuator/drive-config";
import type { ControllerConfig } from "@/sim/control/config";
import { assessMargins } from "@/sim/tuning/robustness/assessment";
import { controllerFromBlock, plantFromModel } from "@/sim/tuning/robustness/loop";
import { computeMargins } from "@/sim/tuning/robustness/margins";
import type { RecordDocument, RecordModel } from "./record-document";

const finiteOrNull = (x: number) => (Number.isFinite(x) ? x : null);

export function recordMargins(
  model: RecordModel | null,
  controller: ControllerConfig,
  drive: DriveConfig | null,
  sensorLagS: number,
): RecordDocument["margins"] {
  // on/off control has no linear margins; a zero gain has no loop to assess
  if (!model || controller.kind !== "pid" || controller.kc <= 0 || model.gainCPerPercent === 0) return null;
  const lags = {
    pvFilterTauS: controller.pvFilterTauS,
    sensorLagS,
    sampleTimeS: controller.sampleTimeS,
    cycleTimeS: drive?.kind === "time-proportioning" ? drive.cycleTimeS : 0,
  };
  const m = computeMargins({ plant: plantFromModel(model), controller: controllerFromBlock(controller), lags });
  const a = assessMargins(m);
  return {
    gainMargin: finiteOrNull(m.gainMargin),
    phaseMarginDeg: finiteOrNull(m.phaseMarginDeg),
    ms: finiteOrNull(m.maxSensitivity),
    verdict: a.verdict,
    delayMarginS: finiteOrNull(m.delayMarginS),
    messages: a.messages,
    lags,
  };
}
