/**
 * Scenario files: YAML text to a validated scenario (errors with path, line and column) and back.
 */
import { Document, LineCounter, isAlias, isMap, isScalar, isSeq, parseDocument, visit } from 'yaml'
import type { Node as YamlNode } from 'yaml'
import type { z } from 'zod'
import { MAX_SCENARIO_BYTES, MAX_YAML_ALIASES, SCENARIO_FORMAT } from './constants'
import { scenarioSchema } from './schema'
import type { Scenario } from './schema'

/** A problem at a path into the scenario, e.g. `injects[4].teams[0]` ('' for the whole file). */
export interface ScenarioIssue { path: string; message: string }
/** A problem in a scenario file, with its 1-based line and column. */
export interface ScenarioError extends ScenarioIssue { line: number; column: number }

export type ValidateResult = { ok: true; scenario: Scenario } | { ok: false; errors: ScenarioIssue[] }
export type ParseResult
  = | { ok: true; scenario: Scenario; document: Document.Parsed }
    | { ok: false; errors: ScenarioError[] }

type Segment = string | number

/** `['injects', 4, 'teams', 0]` → `injects[4].teams[0]`. */
export function formatIssuePath(path: readonly PropertyKey[]): string {
  return path.reduce<string>((out, seg) =>
    typeof seg === 'number' ? `${out}[${seg}]` : out ? `${out}.${String(seg)}` : String(seg), '')
}

/** `12:5 injects[4].teams[0]: unknown team "ops"`. */
export function formatScenarioError(e: ScenarioError): string {
  return `${e.line}:${e.column} ${e.path ? `${e.path}: ` : ''}${e.message}`
}

interface RawIssue { path: Segment[]; message: string; offset?: number; atKey?: boolean }

function rawIssues(error: z.ZodError): RawIssue[] {
  return error.issues.flatMap((issue): RawIssue[] => {
    const path = issue.path.map(p => (typeof p === 'number' ? p : String(p)))
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map(key => ({ path: [...path, key], message: `unknown key "${key}"`, atKey: true }))
    }
    const offset = issue.code === 'custom' && typeof issue.params?.offset === 'number' ? issue.params.offset : undefined
    return [offset === undefined ? { path, message: issue.message } : { path, message: issue.message, offset }]
  })
}

/** Validates an already-parsed value (e.g. from the editor's JSON). */
export function validateScenario(value: unknown): ValidateResult {
  const result = scenarioSchema.safeParse(value)
  if (result.success) return { ok: true, scenario: result.data }
  return { ok: false, errors: rawIssues(result.error).map(i => ({ path: formatIssuePath(i.path), message: i.message })) }
}

function utf8Bytes(text: string): number {
  let n = 0
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i)
    if (c < 0x80) n += 1
    else if (c < 0x800) n += 2
    else if (c >= 0xd800 && c < 0xdc00) { n += 4; i++ }
    else n += 3
  }
  return n
}

/** Position of a text offset inside a scalar's value, where the scalar's style makes it exact. */
function offsetPosition(text: string, node: YamlNode, offset: number, lc: LineCounter): { line: number; column: number } | undefined {
  if (!isScalar(node) || typeof node.value !== 'string' || !node.range) return undefined
  const value = node.value
  const source = text.slice(node.range[0], node.range[1])
  if (node.type === 'BLOCK_LITERAL') {
    // An explicit indentation indicator (`|2`) is rare: fall back to the start of the block.
    if (/^\|[+-]?\d/.test(source)) return undefined
    const contentStart = text.indexOf('\n', node.range[0]) + 1
    const indent = /^( *)\S/m.exec(text.slice(contentStart, node.range[1]))?.[1]?.length ?? 0
    const before = value.slice(0, offset).split('\n')
    return { line: lc.linePos(contentStart).line + before.length - 1, column: indent + (before.at(-1)?.length ?? 0) + 1 }
  }
  if (source.includes('\n')) return undefined
  const start = lc.linePos(node.range[0])
  if (node.type === 'PLAIN' && source === value) return { line: start.line, column: start.col + offset }
  if ((node.type === 'QUOTE_DOUBLE' || node.type === 'QUOTE_SINGLE') && source.slice(1, -1) === value) {
    return { line: start.line, column: start.col + 1 + offset }
  }
  return undefined
}

/** Line and column of a path: its node, else the nearest parent that exists. */
function locate(doc: Document.Parsed, text: string, issue: RawIssue, lc: LineCounter): { line: number; column: number } {
  let node: unknown = doc.contents
  let at = 0
  let exact = true
  for (const [i, seg] of issue.path.entries()) {
    if (isAlias(node)) node = node.resolve(doc)
    const parent = node
    if (isMap(parent)) {
      const pair = parent.items.find(p => (isScalar(p.key) ? p.key.value : p.key) === seg)
      if (!pair) { exact = false; break }
      const keyNode = pair.key as YamlNode
      const last = i === issue.path.length - 1
      if ((issue.atKey && last) || pair.value === null) {
        at = keyNode.range?.[0] ?? at
        node = undefined
        exact = last && !!issue.atKey
        break
      }
      node = pair.value
    }
    else if (isSeq(parent) && typeof seg === 'number' && parent.items[seg] !== undefined) {
      node = parent.items[seg]
    }
    else { exact = false; break }
    const range = (node as YamlNode | null)?.range
    if (range) at = range[0]
  }
  if (exact && issue.offset !== undefined && node) {
    const inner = offsetPosition(text, node as YamlNode, issue.offset, lc)
    if (inner) return inner
  }
  const pos = lc.linePos(at)
  return { line: pos.line, column: pos.col }
}

function fileError(message: string, line = 1, column = 1): ParseResult {
  return { ok: false, errors: [{ path: '', message, line, column }] }
}

/** Parses and validates a scenario file (YAML 1.2), guarding size, syntax and alias bombs. */
export function parseScenarioYaml(text: string): ParseResult {
  const bytes = text.length > MAX_SCENARIO_BYTES ? text.length : utf8Bytes(text)
  if (bytes > MAX_SCENARIO_BYTES) return fileError(`scenario file too large: ${bytes} bytes (limit ${MAX_SCENARIO_BYTES})`)
  const lc = new LineCounter()
  const doc = parseDocument(text, { lineCounter: lc, prettyErrors: true, uniqueKeys: true, merge: false, version: '1.2' })
  if (doc.errors.length) {
    return {
      ok: false,
      errors: doc.errors.map((e) => {
        const pos = e.linePos?.[0] ?? lc.linePos(e.pos[0])
        const message = (e.message.split('\n')[0] ?? e.message).replace(/ at line \d+, column \d+:?$/, '')
        return { path: '', message: `YAML syntax error: ${message}`, line: pos.line, column: pos.col }
      }),
    }
  }
  let value: unknown
  try {
    value = doc.toJS({ maxAliasCount: MAX_YAML_ALIASES })
  }
  catch (e) {
    let first = 0
    visit(doc, { Alias(_, node) { first = node.range?.[0] ?? 0; return visit.BREAK } })
    const pos = lc.linePos(first)
    return fileError(`YAML aliases expand too far (more than ${MAX_YAML_ALIASES} expansions): ${(e as Error).message}`, pos.line, pos.col)
  }
  const result = scenarioSchema.safeParse(value)
  if (result.success) return { ok: true, scenario: result.data, document: doc }
  const errors = rawIssues(result.error).map(issue => ({
    path: formatIssuePath(issue.path), message: issue.message, ...locate(doc, text, issue, lc),
  }))
  errors.sort((a, b) => a.line - b.line || a.column - b.column)
  return { ok: false, errors }
}

const KEY_RE = /^[a-z0-9][a-z0-9-]*$/

/** Scenario to YAML: key order of the schema, literal blocks, flow style for coordinates, sites and lists of keys. */
export function stringifyScenario(scenario: Scenario): string {
  const doc = new Document(scenario, { aliasDuplicateObjects: false })
  visit(doc, {
    Seq(_, seq) {
      const values = seq.items.map(item => (isScalar(item) ? item.value : undefined))
      if (values.length && values.every(v => typeof v === 'number' || (typeof v === 'string' && KEY_RE.test(v)))) seq.flow = true
    },
    Map(_, map) {
      if (map.items.length && map.items.every(p => isScalar(p.value) && typeof p.value.value === 'number')) map.flow = true
    },
  })
  const sites = doc.get('sites', true)
  if (isSeq(sites)) for (const site of sites.items) if (isMap(site)) site.flow = true
  doc.commentBefore = ` Brinkwater scenario (${SCENARIO_FORMAT}). EXERCISE — for training only.`
  return doc.toString({ lineWidth: 0, blockQuote: 'literal', flowCollectionPadding: false })
}
