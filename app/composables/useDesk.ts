import { roleHome } from '~~/shared/utils/roles'

/** The live desks and the reader views each one serves (the facilitator also reads the evaluator desk). */
const DESK_VIEWS = {
  room: ['player'],
  evaluate: ['evaluator', 'control'],
  control: ['control'],
} as const
export type DeskName = keyof typeof DESK_VIEWS

/**
 * One live desk page: the role's snapshot and live feed (useLiveDesk), the exercise with the caller's
 * membership, and what the shared shell (<LiveDeskShell>) shows instead of the desk: a failed first
 * fetch, or a reader whose role belongs at another desk (with the link to their own).
 */
export async function useDesk(exerciseId: string, desk: DeskName, opts: Parameters<typeof useLiveDesk>[1] = {}) {
  const live = useLiveDesk(exerciseId, opts)
  const [{ data: info }] = await Promise.all([useFetch(`/api/exercises/${exerciseId}`, { key: `exercise-${exerciseId}` }), live.snapshot])
  const failure = computed(() => {
    const error = live.snapshot.error.value
    if (!error || live.data.value) return null
    return error.statusCode === 404 ? 'No such exercise, or you are not a member of it.' : error.message
  })
  const views: readonly string[] = DESK_VIEWS[desk]
  const wrongDesk = computed(() => !!live.data.value && !views.includes(live.data.value.view))
  const role = computed(() => info.value?.membership?.role ?? null)
  const home = computed(() => (role.value ? roleHome(exerciseId, role.value) : `/exercises/${exerciseId}`))
  return { ...live, info, role, home, failure, wrongDesk }
}
