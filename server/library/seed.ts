import { and, eq } from 'drizzle-orm'
import type { ExerciseRole } from '#shared/utils/roles'
import { startExercise } from './exercises'
import { scenariosDir, seedScenarios } from './scenarios'

export const DEMO_ACCOUNTS: Array<{
  email: string
  name: string
  systemRole: 'admin' | 'member'
  role?: ExerciseRole
  teamKey?: string
  canAuthor?: boolean
}> = [
  { email: 'admin@brinkwater.test', name: 'Avery Holm (admin)', systemRole: 'admin' },
  { email: 'facilitator@brinkwater.test', name: 'Mira Castell', systemRole: 'member', role: 'facilitator', canAuthor: true },
  { email: 'science@brinkwater.test', name: 'Tomas Reyl', systemRole: 'member', role: 'player', teamKey: 'science' },
  { email: 'civil@brinkwater.test', name: 'Ines Varga', systemRole: 'member', role: 'player', teamKey: 'civil' },
  { email: 'comms@brinkwater.test', name: 'Noor Adeyemi-Lind', systemRole: 'member', role: 'player', teamKey: 'comms' },
  { email: 'evaluator@brinkwater.test', name: 'Jonas Petrel', systemRole: 'member', role: 'evaluator' },
  { email: 'analyst@brinkwater.test', name: 'Sela Brandt', systemRole: 'member', role: 'analyst' },
]

export const DEMO_SCENARIO_KEY = 'demo-ocean-impact'
export const DEMO_EXERCISE_TITLE = 'Demo drill — Gannet ocean impact off the Western Shore'

/** Creates the demo accounts and the demo exercise; running it again changes nothing. */
export async function seedDemo(): Promise<void> {
  const db = useDB()
  const password = serverConfig().demoPassword
  const hash = await hashPassword(password)
  const ids = new Map<string, string>()
  for (const a of DEMO_ACCOUNTS) {
    const found = db.select().from(schema.users).where(eq(schema.users.email, a.email)).get()
    const row = found ?? db.insert(schema.users).values({
      email: a.email,
      name: a.name,
      systemRole: a.systemRole,
      passwordHash: hash,
      canAuthor: a.canAuthor ?? false,
    }).returning().get()
    ids.set(a.email, row.id)
  }
  await seedScenarios()
  let exercise = db.select().from(schema.exercises).where(eq(schema.exercises.title, DEMO_EXERCISE_TITLE)).get()
  if (!exercise) {
    const scenario = db.select().from(schema.scenarios).where(eq(schema.scenarios.key, DEMO_SCENARIO_KEY)).get()
    const facilitator = db.select().from(schema.users).where(eq(schema.users.email, 'facilitator@brinkwater.test')).get()!
    if (!scenario) throw new Error(`The demo scenario "${DEMO_SCENARIO_KEY}" is missing from ${scenariosDir()}`)
    exercise = startExercise(scenario, {
      title: DEMO_EXERCISE_TITLE,
      description: 'A fictional object is found on course for the sea off an invented stretch of coast.',
    }, facilitator)
  }
  for (const a of DEMO_ACCOUNTS) {
    if (!a.role) continue
    const userId = ids.get(a.email)!
    const has = db.select().from(schema.memberships)
      .where(and(eq(schema.memberships.exerciseId, exercise.id), eq(schema.memberships.userId, userId))).get()
    if (!has) db.insert(schema.memberships).values({ exerciseId: exercise.id, userId, role: a.role, teamKey: a.teamKey ?? null }).run()
  }
}
