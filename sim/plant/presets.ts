/**
 * Plant presets: fictional rigs of the Loopwright demo training centre (the "Kestrel Fen Technical College" mechatronics lab,
 * invented here). The numbers are our own estimates for enclosures of this size, stated with
 * their reasoning so an instructor can judge them.
 */
import type { SensorChainConfigInput } from "../sensor/config";
import { enclosureParamsSchema, type EnclosureParams, type EnclosureParamsInput } from "./enclosure-params";

export interface PlantPreset {
  id: string;
  title: string;
  description: string;
  plant: EnclosureParams;
  /** suggested sensor chain for drills on this rig (a drill may override it) */
  sensor: SensorChainConfigInput;
  /** suggested excess-temperature cutout set point, °C */
  cutoutTripC: number;
}

const benchtop: EnclosureParamsInput = {
  kind: "enclosure",
  name: "Bench cabinet C-2 (benchtop curing cabinet)",
  volumeM3: 0.12, // 0.5 × 0.5 × 0.48 m inside
  wallAreaM2: 1.5, // six faces of the inner box
  wallUValueWPerM2K: 0.8, // ≈ 40 mm mineral wool between steel skins
  innerFilmCoefficientWPerM2K: 12, // circulation fan inside
  outerFilmCoefficientWPerM2K: 9, // still-air convection + radiation on painted steel
  wallHeatCapacityJPerK: 12000, // 1.2 mm inner steel skin (≈ 14 kg × 480 J/(kg K)), shelves, frame, part of the wool
  heaterRatingW: 800,
  nominalVoltageV: 230,
  heaterHeatCapacityJPerK: 450, // ≈ 0.9 kg heavy tubular sheathed element
  heaterTimeConstantS: 90,
  inletAirflowM3PerH: 12, // small purge fan for solvent vapour
  doorOpenAirflowM3PerH: 150,
  ambientC: 21,
  pressurePa: 101325,
  contents: { massKg: 4, specificHeatJPerKgK: 900, airCouplingWPerK: 8 }, // aluminium trays
  sensorTimeConstantS: 15, // 6 mm sheathed Pt100 in a protection tube
  lossModel: "linear",
};

const walkIn: EnclosureParamsInput = {
  kind: "enclosure",
  name: "Drying room D-1 (walk-in drying room)",
  volumeM3: 12, // 2.5 × 2.0 × 2.4 m inside
  wallAreaM2: 30,
  wallUValueWPerM2K: 0.45, // 80–100 mm PIR sandwich panels
  innerFilmCoefficientWPerM2K: 8,
  outerFilmCoefficientWPerM2K: 8,
  wallHeatCapacityJPerK: 400000, // panel skins ≈ 280 kg steel, racks and the floor slab's active layer
  heaterRatingW: 9000,
  nominalVoltageV: 400,
  heaterHeatCapacityJPerK: 6000, // ≈ 12 kg finned air heater battery
  heaterTimeConstantS: 120,
  inletAirflowM3PerH: 250, // moisture exhaust
  doorOpenAirflowM3PerH: 1200,
  ambientC: 16,
  pressurePa: 101325,
  contents: { massKg: 300, specificHeatJPerKgK: 1700, airCouplingWPerK: 120 }, // timber on racks
  sensorTimeConstantS: 40, // Pt100 in a thermowell
  lossModel: "linear",
};

const relayPractice: EnclosureParamsInput = {
  ...benchtop,
  name: "Bench cabinet C-4 (noisy-sensor variant for relay-test practice)",
  contents: { massKg: 2, specificHeatJPerKgK: 900, airCouplingWPerK: 6 },
  sensorTimeConstantS: 4, // bare thin-film element: fast, and it picks up noise
};

export const PLANT_PRESETS: readonly PlantPreset[] = [
  {
    id: "benchtop-curing-cabinet",
    title: "Benchtop curing cabinet",
    description: "0.12 m³ insulated cabinet, 800 W element, 12 m³/h purge; settles in most of an hour.",
    plant: enclosureParamsSchema.parse(benchtop),
    sensor: { transmitter: { rangeLowC: 0, rangeHighC: 200 }, noise: { sdMa: 0.004 } },
    cutoutTripC: 150,
  },
  {
    id: "walk-in-drying-room",
    title: "Walk-in drying room",
    description: "12 m³ panel room, 9 kW heater battery, 250 m³/h exhaust, 300 kg of timber; slow.",
    plant: enclosureParamsSchema.parse(walkIn),
    sensor: { transmitter: { rangeLowC: 0, rangeHighC: 150 }, noise: { sdMa: 0.004 } },
    cutoutTripC: 95,
  },
  {
    id: "relay-practice-noisy-cabinet",
    title: "Noisy-sensor cabinet (relay-test practice)",
    description: "The benchtop cabinet with a fast bare element on a long unshielded run: ±0.3 °C of noise.",
    plant: enclosureParamsSchema.parse(relayPractice),
    // 0.025 mA on a 16 mA / 200 °C span is 0.31 °C standard deviation
    sensor: { transmitter: { rangeLowC: 0, rangeHighC: 200 }, noise: { sdMa: 0.025, spikeProbability: 0.002, spikeAmplitudeMa: 0.2 } },
    cutoutTripC: 150,
  },
];

export function findPreset(id: string): PlantPreset | undefined {
  return PLANT_PRESETS.find((p) => p.id === id);
}
