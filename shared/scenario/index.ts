/** The Brinkwater scenario file: schema, hazard fields in inject text, YAML import and export. */
export * from './constants'
export {
  scenarioSchema, keySchema, objectiveSchema, teamSchema, clockSchema, phaseSchema,
  solutionEntrySchema, decisionSchema, injectSchema, criterionSchema,
} from './schema'
export type {
  Scenario, ScenarioInput, Objective, Team, ScenarioClock, Phase, SolutionEntry, Inject, Decision, Criterion,
} from './schema'
export { scenarioTimeSchema, scenarioTime } from './time'
export { scenarioEndTime, currentSolutionAt } from './checks'
export { HAZARD_FIELDS, findHazardFields, validateHazardFields, renderHazardFields } from './fields'
export type { HazardFieldSpec, HazardFieldRef, HazardFieldIssue } from './fields'
export { parseScenarioYaml, stringifyScenario, validateScenario, formatIssuePath, formatScenarioError } from './io'
export type { ScenarioIssue, ScenarioError, ParseResult, ValidateResult } from './io'
export {
  encounterSchema, encounterSolution, applyEncounter, checkEncounters, greatCircleKm,
  ENCOUNTER_TOLERANCE, ENCOUNTER_SAMPLES, ENCOUNTER_SAMPLE_BUDGET, MAX_B_PLANE_KM,
} from './encounter'
export type { ScenarioEncounter, EncounterIssue } from './encounter'
