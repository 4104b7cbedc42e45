import { randomBytes } from 'node:crypto'
import { and, desc, eq, isNull } from 'drizzle-orm'
import { phaseAt } from '#shared/live/schedule'
import { DRILL, rooms } from '#shared/live/visibility'
import { foldEvents, latestImpactTime } from '#shared/live/fold'
import type { WallSolutionData } from '#shared/live/types'
import { clockNow } from './clock'
import { useIO } from './realtime'
import { latestSeq, liveExercise, visibleEvents } from './record'

/** Creates a share link for the wall view; the token is returned once and only its hash is kept. */
export function createWallToken(exerciseId: string, label: string, userId: string) {
  const token = randomBytes(32).toString('base64url')
  const row = useDB().insert(schema.wallTokens).values({
    exerciseId,
    tokenHash: hashToken(token),
    label,
    createdBy: userId,
  }).returning().get()
  audit(userId, 'exercise.wall.create', exerciseId, { tokenId: row.id })
  return { id: row.id, label: row.label, createdAt: row.createdAt, token, path: `/wall/${token}` }
}

/** An exercise's wall links (without tokens), newest first. */
export function listWallTokens(exerciseId: string) {
  return useDB().select({
    id: schema.wallTokens.id,
    label: schema.wallTokens.label,
    createdAt: schema.wallTokens.createdAt,
    revokedAt: schema.wallTokens.revokedAt,
  })
    .from(schema.wallTokens).where(eq(schema.wallTokens.exerciseId, exerciseId)).orderBy(desc(schema.wallTokens.createdAt)).all()
}

/** Revokes a wall link and disconnects the walls that use it; unknown → 404. */
export function revokeWallToken(exerciseId: string, tokenId: string, userId: string): void {
  const res = useDB().update(schema.wallTokens).set({ revokedAt: new Date() })
    .where(and(eq(schema.wallTokens.id, tokenId), eq(schema.wallTokens.exerciseId, exerciseId), isNull(schema.wallTokens.revokedAt))).run()
  if (res.changes === 0) throw notFound('No such wall link.')
  audit(userId, 'exercise.wall.revoke', exerciseId, { tokenId })
  useIO()?.in(rooms.wallToken(tokenId)).disconnectSockets(true)
}

/** The live wall link of a token, or null (unknown or revoked). */
export function findWallToken(token: string) {
  const row = useDB().select().from(schema.wallTokens).where(eq(schema.wallTokens.tokenHash, hashToken(token))).get()
  return row && !row.revokedAt ? row : null
}

/** How many public injects the wall snapshot lists. */
const WALL_INJECTS = 8

/**
 * The wall view (no sign-in, by share link): clock, phase, the current solution's headline figures
 * and corridor, and the latest public injects — those sent to every team of the scenario.
 */
export function wallSnapshot(exerciseId: string) {
  const exercise = liveExercise(useDB(), exerciseId)
  const { clock, scenarioNow } = clockNow(exercise)
  const events = visibleEvents(exerciseId, { kind: 'wall' })
  const feed = foldEvents(events)
  const solution = (events.filter(e => e.type === 'solution.published').at(-1)?.data ?? null) as WallSolutionData | null
  return {
    exercise: { id: exercise.id, title: exercise.title, status: exercise.status, teams: exercise.scenario.teams },
    clock, scenarioNow: new Date(scenarioNow).toISOString(), serverTime: Date.now(),
    phase: phaseAt(exercise.scenario, scenarioNow), phases: exercise.scenario.phases,
    currentSolution: solution,
    timeZone: exercise.scenario.clock.timeZone ?? 'UTC',
    // The places of the scenario, named on the wall's map (no figures of theirs: the wall has no assessment).
    sites: exercise.scenario.sites,
    impactTime: latestImpactTime(events),
    zones: feed.zones.filter(z => !z.withdrawn),
    injects: feed.injects.slice(-WALL_INJECTS).reverse().map(({
      key,
      title,
      kind,
      phase,
      teams,
      at,
      body,
      revision,
      releasedAt,
    }) => ({ key, title, kind, phase, teams, at, body, revision, releasedAt })),
    lastSeq: latestSeq(exerciseId),
    drill: DRILL,
  }
}
