import { wallParamsSchema } from '#shared/schemas/live'
import { findWallToken, wallSnapshot } from '~~/server/live'

// The wall view by share link, without sign-in: unknown or revoked links → 404.
export default defineEventHandler((event) => {
  const { token } = paramsValid(event, wallParamsSchema)
  const wall = findWallToken(token)
  if (!wall) throw createError({ statusCode: 404, message: 'This wall link is not valid (it may have been revoked).' })
  return wallSnapshot(wall.exerciseId)
})
