import { defineStore } from 'pinia'
import { validateScenario } from '~~/shared/scenario'
import type { Scenario } from '~~/shared/scenario'
import type { OrbitSolution, Site } from '~~/shared/hazard/schema'
import type { Assessment } from '~~/shared/hazard/types'
import type { FieldIssue } from '~~/shared/utils/issues'
import { fieldId, tabOfPath } from '~/utils/scenarioPaths'
import type { EditorTab } from '~/utils/scenarioPaths'

export interface ScenarioAttachmentInfo { id: string; path: string; name: string; contentType: string; size: number }
export interface LoadedScenario { id: string; revision: number; document: unknown; attachments?: ScenarioAttachmentInfo[] }

/** The scenario being edited: a local copy of the document, its problems, and saving. */
export const useScenarioEditor = defineStore('scenarioEditor', () => {
  const id = ref('')
  const revision = ref(0)
  const doc = ref<Scenario | null>(null)
  const savedJson = ref('')
  const attachments = ref<ScenarioAttachmentInfo[]>([])
  const localIssues = ref<FieldIssue[]>([])
  const serverIssues = ref<FieldIssue[]>([])
  const notice = ref<{ kind: 'ok' | 'error'; text: string } | null>(null)
  const conflict = ref(false)
  const saving = ref(false)
  const tab = ref<EditorTab>('overview')
  const solutionIndex = ref(0)
  const injectIndex = ref<number | null>(null)
  /** Bumped on every load, so forms with local state (keyed by it) start afresh. */
  const loads = ref(0)
  // Assessments by request, so switching back and forth does not ask the server again.
  const previews = new Map<string, Promise<Assessment>>()

  const dirty = computed(() => !!doc.value && JSON.stringify(doc.value) !== savedJson.value)
  const issues = computed<FieldIssue[]>(() => {
    const seen = new Set<string>()
    return [...serverIssues.value, ...localIssues.value].filter((i) => {
      const k = `${i.path}\n${i.message}`
      return seen.has(k) ? false : (seen.add(k), true)
    })
  })
  const issueCounts = computed(() => {
    const counts: Partial<Record<EditorTab, number>> = {}
    for (const i of issues.value) counts[tabOfPath(i.path)] = (counts[tabOfPath(i.path)] ?? 0) + 1
    return counts
  })

  function validateNow() {
    const r = doc.value ? validateScenario(doc.value) : { ok: true as const }
    localIssues.value = r.ok ? [] : r.errors
  }

  // Every edit is checked against the file schema (debounced); a server verdict lasts until the next edit.
  let timer: ReturnType<typeof setTimeout> | undefined
  if (import.meta.client) {
    watch(doc, () => {
      serverIssues.value = []
      clearTimeout(timer)
      timer = setTimeout(validateNow, 150)
    }, { deep: true })
  }

  function load(data: LoadedScenario, keepView = false) {
    id.value = data.id
    revision.value = data.revision
    doc.value = structuredClone(toRaw(data.document)) as Scenario
    savedJson.value = JSON.stringify(doc.value)
    if (data.attachments) attachments.value = data.attachments.map(a => ({ ...a }))
    serverIssues.value = []
    conflict.value = false
    loads.value++
    if (!keepView) {
      tab.value = 'overview'
      solutionIndex.value = 0
      injectIndex.value = null
      notice.value = null
    }
    validateNow()
  }

  async function save(): Promise<boolean> {
    if (!doc.value || saving.value) return false
    validateNow()
    if (localIssues.value.length) {
      notice.value = {
        kind: 'error',
        text: `Nothing was saved: fix the ${localIssues.value.length === 1 ? 'problem' : `${localIssues.value.length} problems`} listed below first.`,
      }
      return false
    }
    saving.value = true
    const sent = JSON.stringify(doc.value)
    try {
      const res = await $fetch<{ revision: number; document: Scenario }>(`/api/scenarios/${id.value}`, {
        method: 'PUT', body: { revision: revision.value, document: doc.value },
      })
      revision.value = res.revision
      savedJson.value = JSON.stringify(res.document)
      // Take the server's copy (with defaults filled in) unless the author typed on meanwhile.
      if (JSON.stringify(doc.value) === sent) doc.value = res.document
      notice.value = { kind: 'ok', text: `Saved as revision ${res.revision}.` }
      await refreshNuxtData('scenarios')
      return true
    }
    catch (e) {
      const err = readFetchError(e)
      if (err.status === 409) conflict.value = true
      serverIssues.value = err.issues
      notice.value = { kind: 'error', text: err.message ?? 'The scenario could not be saved. Try again.' }
      return false
    }
    finally { saving.value = false }
  }

  /** Shows the field of a path: its tab, its solution or inject, then focus. */
  function reveal(path: string) {
    tab.value = tabOfPath(path)
    const m = /^(solutions|injects)\[(\d+)\]/.exec(path)
    if (m?.[1] === 'solutions') solutionIndex.value = Number(m[2])
    if (m?.[1] === 'injects') injectIndex.value = Number(m[2])
    if (!import.meta.client) return
    setTimeout(() => {
      // The field itself, else the nearest enclosing path that has one.
      for (let p = path; p; p = p.replace(/(\.[^.[]+|\[\d+\])$/, '')) {
        const el = document.getElementById(fieldId(p))
        if (el) { el.scrollIntoView({ block: 'center' }); el.focus({ preventScroll: true }); return }
        if (!/(\.[^.[]+|\[\d+\])$/.test(p)) return
      }
    }, 60)
  }

  function issueAt(path: string): string | undefined {
    return issues.value.find(i => i.path === path)?.message
  }

  function issuesUnder(prefix: string): FieldIssue[] {
    return issues.value.filter(i => i.path === prefix || i.path.startsWith(`${prefix}.`) || i.path.startsWith(`${prefix}[`))
  }

  /** The hazard assessment of one solution against sites, from the server (cached per request). */
  function assess(solution: OrbitSolution, sites: Site[], samples: number, seed = 1): Promise<Assessment> {
    const body = { solution, sites, samples, seed }
    const key = JSON.stringify(body)
    let p = previews.get(key)
    if (!p) {
      p = $fetch<Assessment>('/api/scenarios/preview', { method: 'POST', body })
      p.catch(() => previews.delete(key))
      if (previews.size > 60) previews.delete(previews.keys().next().value as string)
      previews.set(key, p)
    }
    return p
  }

  return {
    id, revision, doc, savedJson, attachments, loads, localIssues, serverIssues, notice, conflict, saving, tab, solutionIndex, injectIndex,
    dirty, issues, issueCounts, load, save, validateNow, reveal, issueAt, issuesUnder, assess,
  }
})
