export {
  MAX_BRIX,
  SUCROSE_DENSITY_20C,
  densityFromBrix,
  icumsaSucroseDensity20C,
  sugarKg,
} from './density';
export {
  DEFAULT_SYRUP_BRIX,
  SAP_RATIO_RULES,
  boilHours,
  sapToSyrupRatio,
  syrupLitres,
  waterToEvaporateL,
  type SapRatioOptions,
  type SapRatioRule,
} from './syrup-yield';
export {
  ELEVATION_RANGE_M,
  PRESSURE_RANGE_KPA,
  SATURATION_RANGE_K,
  placePressureKPa,
  saturationPressureKPa,
  saturationTemperatureK,
  standardPressureKPa,
  waterBoilingPointC,
  type BoilingPlace,
} from './boiling-point';
export {
  BPE_BRIX_RANGE,
  BPE_PRESSURE_RANGE_KPA,
  WATER_ACTIVITY_RANGE_C,
  boilingPointElevationC,
  drawOffTargetC,
  sucroseMoleFraction,
  sucroseWaterActivity,
  type DrawOffInput,
} from './draw-off';
export {
  HYDROMETER_BRIX_RANGE,
  HYDROMETER_CALIBRATION_C,
  HYDROMETER_TEMP_RANGE_C,
  VERMONT_DENSITY_CHART,
  hydrometerReadingBrix,
} from './hydrometer';
export { GRADE_CLASSES, GRADE_CLASS_INFO, gradeClass, type GradeClass, type GradeClassInfo } from './grade';
export {
  SPOILAGE_DEFAULTS,
  SPOILAGE_STATE_DEFAULTS,
  spoilageDeadline,
  spoilageState,
  type SpoilageOptions,
  type SpoilageState,
  type SpoilageStateOptions,
} from './spoilage';
export {
  allocate,
  allocateRun,
  type Allotment,
  type RunInputSugar,
  type RunShare,
  type RunTotals,
  type Weight,
} from './allocate';
export {
  KG_PER_POUND,
  LITRES_PER_US_GALLON,
  UNIT_SYSTEMS,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  gallonsToLitres,
  kgToPounds,
  litresToGallons,
  poundsToKg,
  type UnitSystem,
} from './units';
