// Public API of the fuel corrections: Table 54B volume correction, ISO 8217 LCV estimate, ISO 3046-1 LCV
// correction, MEPC.364(79) carbon factors. Pure computation.
export {
  TABLE_54B_BANDS,
  TABLE_54B_MIN_TEMP_C,
  AIR_BUOYANCY_KG_PER_M3,
  table54BMaxTempC,
  table54BBand,
  thermalExpansion54BPerC,
  volumeCorrectionFactor54B,
  volumeAt15M3,
  massAt15Kg,
  massInAirKg,
} from './volume-correction';
export type { Table54BBand, ObservedFuelVolume } from './volume-correction';
export {
  ISO_3046_REFERENCE_LCV_KJ_PER_KG,
  ISO_8217_LCV_CONSTANTS,
  estimateLcvMjPerKg,
  fuelCorrectedToIsoLcvKg,
} from './calorific-value';
export type { Iso8217Family, LcvFormulaConstants, LcvEstimateInput } from './calorific-value';
export {
  CF_FUEL_TYPES,
  CF_TABLE,
  FUEL_GRADES,
  LFO_MAX_VISCOSITY_50_CST,
  LFO_MAX_DENSITY_15_KG_PER_M3,
  cfFuelTypeForGrade,
  co2Kg,
} from './carbon-factors';
export type { CfFuelType, CfEntry, FuelGrade, ResidualLotProperties, CfMappingBasis } from './carbon-factors';
