import { z } from 'zod'
import { orbitSolutionSchema, siteSchema } from '~~/shared/hazard/schema'
import type { Assessment } from '~~/shared/hazard/types'
import { PUBLISH_SAMPLES } from '~~/shared/live/seed'

/** What to assess; `seed` is the solution's (solutionSeed), so that the preview shows the drill's own figures. */
interface PreviewSource { solution: unknown; sites: unknown; seed?: number }

const sitesSchema = z.array(siteSchema)

/**
 * The live hazard assessment of an (unsaved) orbit solution, from the preview API: debounced,
 * checked locally first, and the latest answer wins. Browser only. By default with a drill's samples.
 */
export function useHazardPreview(source: () => PreviewSource | null, samples = PUBLISH_SAMPLES) {
  const store = useScenarioEditor()
  const assessment = shallowRef<Assessment | null>(null)
  const pending = ref(false)
  const problem = ref('')
  let ticket = 0
  let timer: ReturnType<typeof setTimeout> | undefined

  async function run() {
    const mine = ++ticket
    const src = source()
    if (!src) { assessment.value = null; problem.value = ''; pending.value = false; return }
    const solution = orbitSolutionSchema.safeParse(src.solution)
    const sites = sitesSchema.safeParse(src.sites)
    if (!solution.success || !sites.success) {
      assessment.value = null
      pending.value = false
      problem.value = !solution.success ? 'The figures appear when the solution’s fields are valid.' : 'The figures appear when the sites table is valid.'
      return
    }
    pending.value = true
    try {
      const a = await store.assess(solution.data, sites.data, samples, src.seed)
      if (mine === ticket) { assessment.value = a; problem.value = '' }
    }
    catch (e) {
      if (mine === ticket) problem.value = readFetchError(e).message ?? 'The preview could not be computed.'
    }
    finally { if (mine === ticket) pending.value = false }
  }

  if (import.meta.client) {
    let first = true
    watch(() => JSON.stringify(source()), () => {
      clearTimeout(timer)
      pending.value = true
      if (first) { first = false; void run() }
      else timer = setTimeout(run, 350)
    }, { immediate: true })
    onBeforeUnmount(() => { clearTimeout(timer); ticket++ })
  }
  return { assessment, pending, problem }
}
