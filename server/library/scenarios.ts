import { readFileSync, readdirSync, existsSync } from 'node:fs'
import { basename, extname, resolve } from 'node:path'
import { and, eq, like, or } from 'drizzle-orm'
import { parseScenarioYaml, validateScenario } from '#shared/scenario'
import type { Scenario } from '#shared/scenario'
import type { ScenarioIssue } from '#shared/scenario/io'
import type { ScenarioRow, User } from '#shared/types/db'
import { nextFreeKey } from '#shared/utils/keys'
import { putBlob, sniffContentType } from './attachments'

/** A 400 listing each problem of a scenario with its path (and line and column for a file). */
export function scenarioInvalid(errors: Array<ScenarioIssue & { line?: number; column?: number }>, what = 'scenario'): never {
  throw invalidFields(errors.slice(0, 200), `The ${what} has ${errors.length} problem${errors.length === 1 ? '' : 's'}; nothing was saved.`)
}

/** The library list: what a facilitator needs to pick a scenario. */
export function listScenarios() {
  return useDB().select().from(schema.scenarios).orderBy(schema.scenarios.title).all().map(summarise)
}

export function summarise(row: ScenarioRow) {
  const d = row.document
  const last = d.solutions.at(-1)
  return {
    id: row.id, key: row.key, title: row.title, summary: d.summary, revision: row.revision, origin: row.origin,
    updatedAt: row.updatedAt, createdAt: row.createdAt,
    counts: {
      teams: d.teams.length,
      solutions: d.solutions.length,
      sites: d.sites.length,
      injects: d.injects.length,
      criteria: d.criteria.length,
    },
    scenarioStart: d.clock.scenarioStart, impactTime: d.clock.impactTime, plannedWallMinutes: d.clock.plannedWallMinutes,
    finalImpactProbability: last?.solution.impactProbability ?? null,
  }
}

export function getScenarioRow(id: string): ScenarioRow {
  const row = useDB().select().from(schema.scenarios).where(eq(schema.scenarios.id, id)).get()
  if (!row) throw notFound('No such scenario.')
  return row
}

/** A key not yet in the library: `base`, else `base-2`, `base-3`, … */
export function freeKey(base: string): string {
  const stem = base.replace(/-\d+$/, '').slice(0, 56) || 'scenario'
  const taken = useDB().select({ key: schema.scenarios.key }).from(schema.scenarios)
    .where(or(eq(schema.scenarios.key, base), like(schema.scenarios.key, `${stem}%`))).all().map(r => r.key)
  return nextFreeKey(base, taken, 'scenario')
}

export function keyTaken(key: string, exceptId?: string): boolean {
  const row = useDB().select({ id: schema.scenarios.id }).from(schema.scenarios).where(eq(schema.scenarios.key, key)).get()
  return !!row && row.id !== exceptId
}

/** A new, valid scenario to start editing from. */
export function blankScenario(title: string, key: string): Scenario {
  const start = new Date(Date.UTC(new Date().getUTCFullYear() + 5, 2, 1))
  const impact = new Date(start.getTime() + 180 * 86400_000)
  const doc = {
    format: 'brinkwater-scenario/1', key, title,
    summary: 'Describe the situation the players face, who they are and what the drill is for.',
    objectives: [{
      key: 'shared-picture',
      title: 'Keep one shared picture of the threat',
      description: 'Turn each orbit solution into figures planners can use and share them across the teams.',
      capabilities: ['Situational Assessment'],
    }],
    teams: [
      { key: 'science', name: 'Science team', colour: '#2f6f9f' },
      { key: 'civil', name: 'Civil protection', colour: '#8a5a12' },
      { key: 'comms', name: 'Public information', colour: '#6b4a9b' },
    ],
    clock: {
      scenarioStart: start.toISOString().replace('.000Z', 'Z'),
      impactTime: impact.toISOString().replace('.000Z', 'Z'),
      plannedWallMinutes: 240,
    },
    phases: [
      { key: 'detection', title: 'Detection' }, { key: 'follow-up', title: 'Follow-up' },
      { key: 'decision', title: 'Decision to act' }, { key: 'warning', title: 'Warning and evacuation' },
      { key: 'impact', title: 'Impact' }, { key: 'aftermath', title: 'Aftermath' },
    ],
    solutions: [], sites: [], injects: [], criteria: [],
  }
  const checked = validateScenario(doc)
  if (!checked.ok) throw new Error(`blank scenario is invalid: ${JSON.stringify(checked.errors)}`)
  return checked.scenario
}

export function insertScenario(doc: Scenario, origin: ScenarioRow['origin'], by: string | null): ScenarioRow {
  return useDB().insert(schema.scenarios).values({
    key: doc.key,
    title: doc.title,
    document: doc,
    origin,
    createdBy: by,
    updatedBy: by,
  }).returning().get()
}

/** Saves an edited document; the caller must name the revision it loaded (409 when it moved on). */
export function saveScenario(row: ScenarioRow, value: unknown, revision: number, user: User): ScenarioRow {
  if (revision !== row.revision) {
    throw conflict(
      'Someone saved this scenario after you opened it. Reload to see their changes, then edit again.',
      { revision: row.revision },
    )
  }
  const checked = validateScenario(value)
  if (!checked.ok) scenarioInvalid(checked.errors)
  const doc = checked.scenario
  if (keyTaken(doc.key, row.id)) scenarioInvalid([{ path: 'key', message: `another scenario already has the key "${doc.key}"` }])
  // Conditional on the revision, in one IMMEDIATE transaction: of two saves of one revision (two processes on one
  // file), only one changes the row; the other gets 409.
  const updated = useDB().transaction(tx => tx.update(schema.scenarios)
    .set({ key: doc.key, title: doc.title, document: doc, revision: revision + 1, updatedBy: user.id })
    .where(and(eq(schema.scenarios.id, row.id), eq(schema.scenarios.revision, revision))).returning().get(), { behavior: 'immediate' })
  if (!updated) throw savedMeanwhile(row.id)
  audit(user.id, 'scenario.save', row.id, { revision: updated.revision })
  return updated
}

/** 409 for a save that lost the race to another one of the same revision. */
function savedMeanwhile(id: string) {
  const now = useDB().select({ revision: schema.scenarios.revision }).from(schema.scenarios).where(eq(schema.scenarios.id, id)).get()
  return conflict(
    'Someone saved this scenario after you opened it. Reload to see their changes, then edit again.',
    { revision: now?.revision ?? null },
  )
}

/** Imports a YAML file; `onConflict` decides what happens when its key is already in the library. */
export function importScenario(text: string, onConflict: 'refuse' | 'copy' | 'replace', user: User) {
  const parsed = parseScenarioYaml(text)
  if (!parsed.ok) scenarioInvalid(parsed.errors, 'file')
  const doc = parsed.scenario
  const existing = useDB().select().from(schema.scenarios).where(eq(schema.scenarios.key, doc.key)).get()
  if (existing && onConflict === 'refuse') {
    throw conflict(
      `The library already has a scenario with the key "${doc.key}". Import it as a copy, or replace the existing one.`,
      { issues: [{ path: 'key', message: 'already in the library' }], existingId: existing.id },
    )
  }
  if (existing && onConflict === 'replace') {
    const row = useDB().transaction(tx => tx.update(schema.scenarios)
      .set({ title: doc.title, document: doc, revision: existing.revision + 1, origin: 'upload', updatedBy: user.id })
      .where(and(eq(schema.scenarios.id, existing.id), eq(schema.scenarios.revision, existing.revision))).returning().get(),
    { behavior: 'immediate' })
    if (!row) throw savedMeanwhile(existing.id)
    audit(user.id, 'scenario.import.replace', row.id, { key: doc.key })
    return row
  }
  const key = existing ? freeKey(doc.key) : doc.key
  const row = insertScenario({ ...doc, key }, 'upload', user.id)
  audit(user.id, 'scenario.import', row.id, { key })
  return row
}

/** A copy under a new key and title, with the same attachments. */
export function duplicateScenario(row: ScenarioRow, user: User): ScenarioRow {
  const key = freeKey(`${row.key.slice(0, 56)}-copy`)
  const db = useDB()
  return db.transaction((tx) => {
    const copy = tx.insert(schema.scenarios).values({
      key, title: `${row.title} (copy)`.slice(0, 200), document: { ...row.document, key, title: `${row.title} (copy)`.slice(0, 200) },
      origin: 'duplicate', createdBy: user.id, updatedBy: user.id,
    }).returning().get()
    const files = tx.select().from(schema.scenarioAttachments).where(eq(schema.scenarioAttachments.scenarioId, row.id)).all()
    for (const f of files) {
      tx.insert(schema.scenarioAttachments).values({
        scenarioId: copy.id,
        path: f.path,
        name: f.name,
        contentType: f.contentType,
        size: f.size,
        sha256: f.sha256,
      }).run()
    }
    return copy
  })
}

export function scenariosDir(): string {
  return serverConfig().scenariosDir
}

/**
 * Loads every `*.yaml` file of the scenarios folder into the library (with the attachments its
 * injects name). A key already in the library is left alone, so seeding twice adds nothing and
 * never overwrites edits. A broken file is reported and skipped.
 */
export async function seedScenarios(): Promise<void> {
  const dir = scenariosDir()
  if (!existsSync(dir)) return
  for (const file of readdirSync(dir).filter(f => ['.yaml', '.yml'].includes(extname(f))).sort()) {
    const parsed = parseScenarioYaml(readFileSync(resolve(dir, file), 'utf8'))
    if (!parsed.ok) {
      console.error(`[seed] ${file}: ${parsed.errors.length} problems, skipped; first: ${parsed.errors[0]?.line}:${parsed.errors[0]?.column} ${parsed.errors[0]?.path}: ${parsed.errors[0]?.message}`)
      continue
    }
    const doc = parsed.scenario
    if (useDB().select({ id: schema.scenarios.id }).from(schema.scenarios).where(eq(schema.scenarios.key, doc.key)).get()) continue
    const row = insertScenario(doc, 'seed', null)
    const paths = new Map<string, string>()
    for (const inject of doc.injects) for (const a of inject.attachments ?? []) paths.set(a.path, a.name)
    for (const [path, name] of paths) {
      const full = resolve(dir, path)
      if (!full.startsWith(dir + '/') || !existsSync(full)) {
        console.error(`[seed] ${file}: attachment ${path} not found`)
        continue
      }
      const data = new Uint8Array(readFileSync(full))
      const contentType = sniffContentType(data, basename(full))
      if (!contentType) continue
      const sha256 = await putBlob(data)
      useDB().insert(schema.scenarioAttachments).values({ scenarioId: row.id, path, name, contentType, size: data.length, sha256 }).run()
    }
  }
}
