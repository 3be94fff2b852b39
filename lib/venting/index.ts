/**
 * Flueward's venting and combustion-air engine: pure functions over plain data. Runs in the
 * browser and on the server; imports nothing but zod.
 *
 * Typical use:
 * ```ts
 * const rb = prepareRulebook(content);          // once per rulebook version
 * const input = checkInputSchema.parse(body);   // once per request
 * const { findings, summary } = evaluateInspection(input, rb);
 * ```
 */
export * from "./enums";
export * from "./units";
export {
  applianceSchema,
  connectorSegmentSchema,
  ventSchema,
  terminationOpeningSchema,
  terminationSchema,
  ventRunSchema,
  roomSchema,
  airOpeningSchema,
  airSpaceSchema,
  readingsSchema,
  removedApplianceSchema,
  checkInputSchema,
  returnAirSchema,
  returnAirOpeningSchema,
} from "./inputs";
export type {
  Appliance,
  ConnectorSegment,
  Vent,
  TerminationOpeningInput,
  Termination,
  VentRun,
  Room,
  AirOpening,
  AirSpace,
  Readings,
  RemovedAppliance,
  CheckInput,
  CheckInputRaw,
  ReturnAir,
  ReturnAirOpening,
} from "./inputs";
export {
  FINDING_CODES,
  FINDING_CATALOGUE,
  FINDING_STATUSES,
  MESSAGES,
} from "./findings";
export type {
  Finding,
  FindingCode,
  FindingStatus,
  FindingTarget,
  FindingCatalogueEntry,
  Quantity,
  Requirement,
  Comparator,
  SafetyFlag,
  TargetSection,
} from "./findings";
export { PARAMETER_DEFINITIONS, PARAMETER_KEYS } from "./rulebook/parameters";
export type { ParameterKey, ParameterDefinition } from "./rulebook/parameters";
export {
  RULEBOOK_TABLES,
  RULEBOOK_TABLE_KEYS,
  rulebookContentSchema,
  parameterRowSchema,
  connectorLengthShareRowSchema,
  clearanceRowSchema,
  supportSpacingRowSchema,
  fastenerRowSchema,
  prohibitedPassageRowSchema,
  terminationHeightRowSchema,
  terminationDistanceRowSchema,
  capacityRowSchema,
  ventConnectorCapacityRowSchema,
  commonVentCapacityRowSchema,
  louverShareRowSchema,
  flueCoLimitRowSchema,
  returnAirSpaceRowSchema,
} from "./rulebook/tables";
export type {
  RulebookContent,
  RulebookRow,
  RulebookTableKey,
  ColumnDefinition,
  ColumnKind,
  TableDefinition,
  CapacityRow,
  VentConnectorCapacityRow,
  CommonVentCapacityRow,
  ParameterRow,
  TerminationHeightRow,
  ReturnAirSpaceRow,
} from "./rulebook/tables";
export { validateRulebookTable, RULEBOOK_MESSAGES } from "./rulebook/validate";
export { validateRulebookContent } from "./rulebook/validate-content";
export type { RulebookIssue } from "./rulebook/validate";
export { prepareRulebook, RulebookInvalidError } from "./rulebook/prepare";
export type { PreparedRulebook, RuleRef, Cited, CapacityGrid, CommonVentGrid, GridTableKey } from "./rulebook/prepare";
export {
  evaluateVentRun,
  evaluateCombustionAir,
  evaluateReadings,
  evaluateOrphanedAppliance,
  evaluateInspection,
  readFindingSummary,
  summarizeFindings,
  evaluateReturnAir,
} from "./evaluate";
export type {
  VentRunResult,
  VentRunSizing,
  SegmentSizing,
  AirSpaceResult,
  AirSpaceSizing,
  CombustionAirOptions,
  InspectionResult,
  FindingSummary,
  ReturnAirResult,
  ReturnAirSizing,
  ReturnOpeningSizing,
} from "./evaluate";
export { requiredRiseIn, supportsNeeded } from "./sizing/rise";
export {
  lookupCapacity,
  lookupInGrid,
  capacityGrid,
  lerp,
  extraTurns,
  deratePct,
  limitsFor,
  fits,
  smallestFittingDiameter,
} from "./sizing/capacity";
export type { CapacityQuery, CapacityLookup, CapacityValues, CapacityMiss, CapacityLimits, DerateRule, TurnsInput, SmallestDiameter } from "./sizing/capacity";
export { assessSingleCapacity } from "./sizing/assess-capacity";
export {
  commonVentColumn,
  commonVentLimit,
  connectorLimits,
  lengthMultipleLossPct,
  smallestCommonVentDiameter,
  smallestConnectorDiameter,
  COMMON_COLUMN_FIELD,
} from "./sizing/common-capacity";
export type { CommonVentColumn, ConnectorProfile, ConnectorRules, ConnectorLimits, ConnectorReading, CommonVentLimit, CommonVentReading, TableMiss } from "./sizing/common-capacity";
export type { CommonVentSizing, CommonConnectorSizing } from "./checks/common-vent-capacity";
export type { CapacitySizing, CapacityAssessment } from "./sizing/assess-capacity";
export {
  requiredVolumeCuFt,
  indoorSameStoryAreaSqIn,
  indoorDifferentStoriesAreaSqIn,
  outdoorOpeningAreaSqIn,
  singleOpeningAreaSqIn,
  grossAreaSqIn,
  combinationFactor,
} from "./sizing/air";
export type { VolumeFactors, VolumeRequirement } from "./sizing/air";
export { airFreeCoPpm, clockedFlowCuFtPerH, clockedInputBtuh, temperatureRiseF, airflowCfm, AMBIENT_O2_PCT, SENSIBLE_HEAT_FACTOR } from "./sizing/readings";
export { connectorLengthLossPct } from "./checks/connector-length-per-diameter";
export { maxHorizontalConnectorFt } from "./checks/connector-horizontal-length";
export { terminationHeightRow } from "./checks/termination-height";
export { ventReductionConsidered } from "./checks/connector-diameter";
export { openingArea, roomVolume } from "./checks/air-context";
export type { OpeningSizing } from "./checks/air-openings";
export { fmt as formatNumber } from "./format";
export {
  furnaceOutputBtuh,
  airflowFromTonsCfm,
  airflowFromRiseCfm,
  requiredReturnAreaSqIn,
  openingAirflowCfm,
  faceVelocityFpm,
  returnGrossAreaSqIn,
  SQIN_PER_SQFT,
} from "./sizing/return-air";
export type { AirflowSource, OutputSource } from "./checks/return-air-context";
