export { SensorChain } from "./chain";
export {
  sensorChainSchema,
  sensorFaultSchema,
  elementSchema,
  transmitterSchema,
  electricalNoiseSchema,
  analogInputSchema,
} from "./config";
export type { SensorChainConfig, SensorChainConfigInput, SensorFault, SensorReading } from "./config";
export * from "./pt100";
export * from "./transmitter";
export * from "./adc";
