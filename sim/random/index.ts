export { SeededRandom } from "./seeded-random";
export { irwinHallGaussian, IRWIN_HALL_TERMS, IRWIN_HALL_EXCESS_KURTOSIS } from "./gaussian";
export type { Uint32Source } from "./gaussian";
export { fmix32, expandSeed, forkSeed } from "./seed-mix";
