/**
 * The Brinkwater scenario file (`format: brinkwater-scenario/1`): one zod schema for the whole
 * script of a drill. Shapes are checked here; cross-references, times and hazard fields in
 * `checks.ts`, whose issues carry paths such as `injects[4].teams[0]`.
 */
import { z } from 'zod'
import { isTimeZone } from '../utils/zone'
import { orbitSolutionSchema, siteSchema } from '../hazard/schema'
import { checkScenario } from './checks'
import { SCENARIO_FORMAT } from './constants'
import { scenarioTimeSchema } from './time'
import { encounterSchema } from './encounter'

/** A stable key: lower-case letters, digits and dashes, as site ids. */
export const keySchema = z.string().regex(/^[a-z0-9][a-z0-9-]{0,62}$/, 'lower-case letters, digits and dashes (max 63)')

const text = (max: number) => z.string().max(max).regex(/\S/, 'must not be empty')

export const objectiveSchema = z.strictObject({
  key: keySchema,
  title: text(200),
  description: text(4000),
  /** Capability targets in the trade's own words (e.g. US core capabilities: "Operational Coordination"). */
  capabilities: z.array(text(120)).min(1).max(20),
})

export const teamSchema = z.strictObject({
  key: keySchema,
  name: text(120),
  colour: z.string().regex(/^#[0-9a-fA-F]{6}$/, 'a colour as #rrggbb'),
  description: text(2000).optional(),
})

export const clockSchema = z.strictObject({
  scenarioStart: scenarioTimeSchema,
  impactTime: scenarioTimeSchema,
  /** Planned length of the drill on the wall clock, minutes. */
  plannedWallMinutes: z.number().int().min(10).max(7 * 24 * 60),
  /** How long after impact the scenario runs on (default DEFAULT_AFTERMATH_DAYS). */
  aftermathDays: z.number().min(0).max(366).optional(),
  /** The time zone of the scenario's coast (IANA, e.g. Europe/Lisbon): desks show its local time beside UTC. Absent: UTC. */
  timeZone: z.string().max(64).refine(isTimeZone, 'an IANA time zone such as Europe/Lisbon').optional(),
})

export const phaseSchema = z.strictObject({
  key: keySchema,
  title: text(120),
  description: text(2000).optional(),
})

// A scenario gives a solution's encounter beside it (the entry's `encounter:`), never inside it.
const { encounter: _engineEncounter, ...solutionShape } = orbitSolutionSchema.shape

export const solutionEntrySchema = z.strictObject({
  key: keySchema,
  label: text(200),
  /** Scenario time at which the drill publishes this solution. */
  releaseAt: scenarioTimeSchema,
  /** The estimate itself, as the hazard engine takes it (unknown keys rejected, not dropped). */
  solution: z.strictObject(solutionShape),
  /** The close encounter this solution is computed from (see encounter.ts): its figures must agree with it. */
  encounter: encounterSchema.optional(),
})

export const decisionSchema = z.strictObject({
  prompt: text(4000),
  choices: z.array(text(300)).min(2).max(12).optional(),
  freeText: z.boolean(),
  deadline: scenarioTimeSchema,
})

/** A path relative to the scenarios folder, without `..`, backslashes or a scheme. */
const attachmentPath = z.string().max(300)
  .regex(/^(?!\/)(?!.*(?:^|\/)\.\.?(?:\/|$))(?!.*\/\/)[A-Za-z0-9._/-]+$/, 'a relative path of letters, digits, ".", "_", "-" and "/", without ".."')

export const injectSchema = z.strictObject({
  key: keySchema,
  at: scenarioTimeSchema,
  phase: keySchema,
  kind: keySchema,
  teams: z.array(keySchema).min(1),
  title: text(300),
  /** Markdown with hazard fields (`{{ energyMt }}`), see fields.ts. */
  body: text(20_000),
  /** The orbit solution this inject presents (a data release): released at or before the inject. */
  solution: keySchema.optional(),
  decision: decisionSchema.optional(),
  /** What good play looks like; facilitator and evaluators only, never shown to players. */
  expectedActions: z.array(text(1000)).max(30),
  /** Released only when the facilitator decides that the condition holds. */
  contingency: z.strictObject({ condition: text(2000) }).optional(),
  attachments: z.array(z.strictObject({ name: text(200), path: attachmentPath })).max(20).optional(),
})

export const criterionSchema = z.strictObject({
  key: keySchema,
  objective: keySchema,
  capability: text(120),
  /** Critical tasks, each rated P, S, M or U by evaluators. */
  tasks: z.array(z.strictObject({ key: keySchema, text: text(1000) })).min(1).max(30),
  /** Injects whose play is evidence for this criterion. */
  injects: z.array(keySchema).max(100),
})

const scenarioShape = z.strictObject({
  format: z.literal(SCENARIO_FORMAT),
  key: keySchema,
  title: text(200),
  summary: text(10_000),
  objectives: z.array(objectiveSchema).min(1).max(30),
  teams: z.array(teamSchema).min(1).max(20),
  clock: clockSchema,
  phases: z.array(phaseSchema).min(1).max(30),
  injectKinds: z.array(keySchema).max(20).optional(),
  solutions: z.array(solutionEntrySchema).max(100),
  sites: z.array(z.strictObject(siteSchema.shape)).max(200),
  injects: z.array(injectSchema).max(500),
  criteria: z.array(criterionSchema).max(200),
})

/** The whole scenario, with cross-reference checks. */
export const scenarioSchema = scenarioShape.superRefine((scenario, ctx) => {
  for (const issue of checkScenario(scenario)) {
    ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message, params: issue.offset === undefined ? undefined : { offset: issue.offset } })
  }
})

export type Scenario = z.infer<typeof scenarioShape>
export type ScenarioInput = z.input<typeof scenarioShape>
export type Objective = z.infer<typeof objectiveSchema>
export type Team = z.infer<typeof teamSchema>
export type ScenarioClock = z.infer<typeof clockSchema>
export type Phase = z.infer<typeof phaseSchema>
export type SolutionEntry = z.infer<typeof solutionEntrySchema>
export type Inject = z.infer<typeof injectSchema>
export type Decision = z.infer<typeof decisionSchema>
export type Criterion = z.infer<typeof criterionSchema>
