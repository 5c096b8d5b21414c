// the moisture check of ISO 13788:2012 (monthly Glaser method and surface check): pure typescript,
// imports nothing outside this folder
export { saturationPressure, saturationTemperature, vapourPressure, P_SAT_0 } from './saturation.ts';
export {
  DAYS_IN_MONTH,
  MONTH_NAMES,
  MONTH_SHORT,
  HUMIDITY_CLASS_DELTA_P,
  HUMIDITY_CLASS_LABELS,
  MOISTURE_SUPPLY_SAFETY_FACTOR,
  moistureSupply,
  insideVapourPressure,
  type Climate,
  type MonthClimate,
  type IndoorClimate,
  type HumidityClass,
} from './climate.ts';
export { glaserYear, lowerHull, diffusionThickness, DELTA_0, INTERSTITIAL_RSE, INTERSTITIAL_RSI, type MoistureLayer, type GlaserYear, type GlaserMonth, type PlaneState } from './glaser.ts';
export { surfaceCheck, temperatureFactor, SURFACE_CHECK_RSI, SURFACE_CHECK_RSE, MOULD_SURFACE_HUMIDITY, type SurfaceCheck, type SurfaceMonth } from './surface.ts';
export {
  assessMoisture,
  assessDocument,
  moistureIssues,
  moistureLayers,
  moistureOutput,
  moistureFromDocument,
  planeIndex,
  MoistureInputError,
  INTERSTITIAL_RSI_BY_DIRECTION,
  type HeatFlowDirection,
  type MoistureAssessment,
  type MoistureVerdictKind,
  type MoistureOutput,
  type MoistureOutputMonth,
  type DocumentLike,
  type DocumentLayerLike,
} from './assess.ts';
export { moistureVerdictText, moistureFigures, planeName, LARGE_AMOUNT, MOISTURE_CAUTIONS, MOISTURE_DEFERRAL, type MoistureVerdictText, type MoistureFigures } from './verdict.ts';
export { glaserDiagramSvg, DIAGRAM_COLOURS, type DiagramOptions } from './diagram.ts';
export { DEMO_CLIMATES, demoClimate, type DemoClimate } from './demoClimates.ts';
export { moistureReport, keyMonth, type MoistureReport, type MoistureReportRow } from './report.ts';
