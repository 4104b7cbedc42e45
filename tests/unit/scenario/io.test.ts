import { describe, expect, it } from 'vitest'
import {
  MAX_SCENARIO_BYTES, formatIssuePath, formatScenarioError, parseScenarioYaml, stringifyScenario, validateScenario,
} from '../../../shared/scenario'
import type { Scenario } from '../../../shared/scenario'
import { MINI_YAML, positionOf } from './fixtures'

function parseMini(): Scenario {
  const result = parseScenarioYaml(MINI_YAML)
  if (!result.ok) throw new Error(result.errors.map(formatScenarioError).join('\n'))
  return result.scenario
}

/** Replaces one unique snippet of the mini scenario. */
function mutate(from: string, to: string): string {
  expect(MINI_YAML.split(from).length, `"${from}" must occur once`).toBe(2)
  return MINI_YAML.replace(from, to)
}

describe('parseScenarioYaml', () => {
  it('accepts the minimal scenario and fills the orbit-solution defaults', () => {
    const s = parseMini()
    expect(s.injects).toHaveLength(2)
    expect(s.solutions[0]?.solution.taxonomicClass).toBe('unknown')
  })

  // Each case: a one-line change, the path and message expected, and the text the error must point at.
  const cases: Array<{ name: string; from: string; to: string; path: string; message: string; at: string }> = [
    {
      name: 'an unknown team', from: 'teams: [comms, science]', to: 'teams: [ops, science]',
      path: 'injects[1].teams[0]', message: 'unknown team "ops"', at: 'ops, science]',
    },
    {
      name: 'an unknown hazard field (at the field itself, inside the block)',
      from: 'Probability {{ impactProbability }}.', to: 'Energy {{ energyMT.p50 }}.',
      path: 'injects[0].body', message: 'unknown hazard field "energyMT.p50" (did you mean "energyMt.p50"?)', at: '{{ energyMT.p50 }}',
    },
    {
      name: 'an unknown hazard field in a one-line plain body', from: 'body: A reporter calls.', to: 'body: A reporter calls {{ energyMT }}.',
      path: 'injects[1].body', message: 'unknown hazard field "energyMT" (did you mean "energyMt"?)', at: '{{ energyMT }}',
    },
    {
      name: 'an unknown hazard field in a one-line quoted body', from: 'body: A reporter calls.', to: 'body: "A reporter {{ energy }}"',
      path: 'injects[1].body', message: 'unknown hazard field "energy"', at: '{{ energy }}',
    },
    {
      name: 'an unknown site in a hazard field', from: '{{ site.port-a.runUpM.p95 }}', to: '{{ site.port-b.runUpM.p95 }}',
      path: 'injects[0].body', message: 'unknown site "port-b" in hazard field "site.port-b.runUpM.p95"', at: '{{ site.port-b',
    },
    {
      name: 'a unit that does not fit the field', from: '{{ impactProbability }}', to: '{{ impactProbability | kt }}',
      path: 'injects[0].body', message: 'unit "kt" does not apply to "impactProbability" (use % or odds)', at: '{{ impactProbability | kt }}',
    },
    {
      name: 'a bad date', from: 'at: 2031-01-03T06:00:00Z', to: 'at: 2031-02-30T06:00:00Z',
      path: 'injects[1].at', message: 'expected an ISO 8601 date-time with a zone, e.g. 2031-03-04T06:30:00Z', at: '2031-02-30T06:00:00Z',
    },
    {
      name: 'a deadline before its inject', from: 'deadline: 2031-01-03T12:00:00Z', to: 'deadline: 2031-01-03T05:00:00Z',
      path: 'injects[1].decision.deadline', message: 'deadline 2031-01-03T05:00:00Z is not after the inject time 2031-01-03T06:00:00Z',
      at: '2031-01-03T05:00:00Z',
    },
    {
      name: 'an inject time after the aftermath', from: 'at: 2031-01-02T06:00:00Z', to: 'at: 2031-03-02T06:00:00Z',
      path: 'injects[0].at',
      message: 'inject time 2031-03-02T06:00:00Z lies outside the scenario (2031-01-01T00:00:00Z to 2031-02-15T00:00:00.000Z)',
      at: '2031-03-02T06:00:00Z',
    },
    {
      name: 'an unknown phase', from: '    phase: detection\n    kind: media-query', to: '    phase: landfall\n    kind: media-query',
      path: 'injects[1].phase', message: 'unknown phase "landfall"', at: 'landfall',
    },
    {
      name: 'an undeclared inject kind', from: 'kind: media-query', to: 'kind: rumour',
      path: 'injects[1].kind', message: 'unknown inject kind "rumour" (declare it in injectKinds)', at: 'rumour',
    },
    {
      name: 'a misspelt key (at the key)', from: 'expectedActions: [Read the figures]', to: 'expectedActions: []\n    notes: [Read the figures]',
      path: 'injects[0].notes', message: 'unknown key "notes"', at: 'notes:',
    },
    {
      name: 'a capability that is not a target of its objective', from: 'capability: Public Information and Warning', to: 'capability: Planning',
      path: 'criteria[0].capability',
      message: 'capability "Planning" is not a target of objective "warn" (Public Information and Warning)', at: 'Planning',
    },
    {
      name: 'a criterion on an unknown inject', from: 'injects: [press-call]', to: 'injects: [press-cal]',
      path: 'criteria[0].injects[0]', message: 'unknown inject "press-cal"', at: 'press-cal]',
    },
    {
      name: 'a missing field (at the nearest parent)', from: '    title: Press call\n', to: '',
      path: 'injects[1].title', message: 'Invalid input: expected string, received undefined', at: 'key: press-call',
    },
  ]

  it.each(cases)('reports $name with its path, line and column', ({ from, to, path, message, at }) => {
    const text = mutate(from, to)
    const result = parseScenarioYaml(text)
    expect(result.ok).toBe(false)
    if (result.ok) return
    expect(result.errors).toEqual([{ path, message, ...positionOf(text, at) }])
  })

  it('reports a duplicate inject key and the reference it leaves dangling', () => {
    const text = mutate('key: press-call', 'key: first-news')
    const result = parseScenarioYaml(text)
    if (result.ok) throw new Error('expected errors')
    const second = positionOf(text, '  - key: first-news\n    at: 2031-01-03')
    expect(result.errors).toEqual([
      { path: 'injects[1].key', message: 'duplicate inject key "first-news" (first at index 0)', line: second.line, column: 10 },
      { path: 'criteria[0].injects[0]', message: 'unknown inject "press-call"', ...positionOf(text, 'press-call]') },
    ])
  })

  it('rejects solutions listed out of release order', () => {
    const s = structuredClone(parseMini())
    const first = s.solutions[0]
    if (!first) throw new Error('fixture')
    s.solutions.push({
      ...structuredClone(first),
      key: 's0',
      releaseAt: '2031-01-01T12:00:00Z',
      solution: { ...first.solution, epoch: '2031-01-01T12:00:00Z' },
    })
    const result = parseScenarioYaml(stringifyScenario(s))
    if (result.ok) throw new Error('expected errors')
    expect(result.errors.map(e => `${e.path}: ${e.message}`)).toEqual([
      'solutions[1].releaseAt: solutions must be listed in order of release: 2031-01-01T12:00:00Z is not after "s1" (2031-01-02T00:00:00Z)',
    ])
  })

  it('points YAML syntax errors at their line and column', () => {
    const text = mutate('    kind: briefing', '\tkind: briefing')
    const result = parseScenarioYaml(text)
    if (result.ok) throw new Error('expected errors')
    expect(result.errors[0]).toEqual({
      path: '',
      message: 'YAML syntax error: Tabs are not allowed as indentation',
      ...positionOf(text, '\tkind'),
    })
  })

  it('rejects duplicate keys in a YAML mapping', () => {
    const result = parseScenarioYaml(mutate('key: mini\n', 'key: mini\nkey: again\n'))
    if (result.ok) throw new Error('expected errors')
    expect(result.errors).toEqual([{ path: '', message: 'YAML syntax error: Map keys must be unique', line: 3, column: 1 }])
  })

  it('rejects an alias bomb before expanding it', () => {
    const bomb = ['a: &a [x, x, x, x, x, x, x, x, x, x]']
    for (const [i, name] of ['b', 'c', 'd', 'e', 'f', 'g', 'h', 'i'].entries()) {
      const prev = String.fromCharCode(97 + i)
      bomb.push(`${name}: &${name} [${Array(10).fill(`*${prev}`).join(', ')}]`)
    }
    const result = parseScenarioYaml(bomb.join('\n'))
    if (result.ok) throw new Error('expected errors')
    expect(result.errors).toHaveLength(1)
    expect(result.errors[0]?.message).toMatch(/^YAML aliases expand too far \(more than 100 expansions\)/)
    // At the first alias: `*a` on the second line.
    expect(result.errors[0]).toMatchObject({ path: '', line: 2, column: 8 })
  })

  it('rejects a file over the size limit without parsing it', () => {
    const result = parseScenarioYaml(`# ${'x'.repeat(MAX_SCENARIO_BYTES)}`)
    expect(result).toEqual({
      ok: false,
      errors: [{
        path: '',
        message: `scenario file too large: ${MAX_SCENARIO_BYTES + 2} bytes (limit ${MAX_SCENARIO_BYTES})`,
        line: 1,
        column: 1,
      }],
    })
  })

  it('counts the size in UTF-8 bytes, not characters', () => {
    const result = parseScenarioYaml(`# ${'é'.repeat(MAX_SCENARIO_BYTES / 2)}`)
    expect(result.ok).toBe(false)
    if (!result.ok) expect(result.errors[0]?.message).toContain(`${MAX_SCENARIO_BYTES + 2} bytes`)
  })

  it('rejects an empty file and a file that is not a mapping', () => {
    for (const text of ['', '- just\n- a list\n']) {
      const result = parseScenarioYaml(text)
      expect(result.ok).toBe(false)
      if (!result.ok) expect(result.errors[0]).toMatchObject({ path: '', line: 1, column: 1 })
    }
  })
})

describe('stringifyScenario', () => {
  it('round-trips the minimal scenario', () => {
    const s = parseMini()
    const again = parseScenarioYaml(stringifyScenario(s))
    expect(again.ok && again.scenario).toEqual(s)
  })

  it('round-trips awkward strings: braces, colons, hashes, quotes, indentation, unicode, trailing spaces', () => {
    const s = structuredClone(parseMini())
    const inject = s.injects[1]
    if (!inject) throw new Error('fixture')
    inject.title = '"Quoted": a title # not a comment'
    inject.body = '{{ impactProbability }} at the start\n  indented line\ttab\ntrailing spaces   \n\nÉvacuation — 5–95 %: ok\n'
    inject.expectedActions = ['- looks like a list', 'yes', '0123', 'null', '@at', '  leading']
    const again = parseScenarioYaml(stringifyScenario(s))
    expect(again.ok && again.scenario).toEqual(s)
  })

  it('writes coordinates, number pairs and lists of keys in flow style, and marks the file as an exercise', () => {
    const text = stringifyScenario(parseMini())
    expect(text).toMatch(/^# Brinkwater scenario \(brinkwater-scenario\/1\)\. EXERCISE/)
    expect(text).toContain('nominal: [-9.5, 39.5]')
    expect(text).toContain('magnitude: {H: 22, sigma: 0.3}')
    expect(text).toContain('teams: [comms, science]')
  })
})

describe('cross-reference checks', () => {
  // Each case edits a copy of the minimal scenario and names the single error it must cause.
  const cases: Array<[string, (s: Scenario) => void, string]> = [
    ['an inject presenting an unknown solution', (s) => { s.injects[0]!.solution = 's9' }, 'injects[0].solution: unknown solution "s9"'],
    ['an inject presenting a solution released after it', (s) => {
      s.injects[0]!.at = '2031-01-01T06:00:00Z'
      s.injects[0]!.body = 'No fields.'
      s.injects[0]!.solution = 's1'
    },
    'injects[0].solution: solution "s1" is released at 2031-01-02T00:00:00Z, after this inject (2031-01-01T06:00:00Z)'],
    ['hazard fields before the first solution', (s) => { s.injects[0]!.at = '2031-01-01T06:00:00Z' },
      'injects[0].body: hazard field "impactProbability" before any orbit solution is released (the first is released at 2031-01-02T00:00:00Z)'],
    ['a solution released before its epoch', (s) => { s.solutions[0]!.solution.epoch = '2031-01-02T01:00:00Z' },
      'solutions[0].solution.epoch: epoch 2031-01-02T01:00:00Z is after the release time 2031-01-02T00:00:00Z'],
    [
      'a criterion on an unknown objective',
      (s) => { s.criteria[0]!.objective = 'calm' },
      'criteria[0].objective: unknown objective "calm"',
    ],
    [
      'a team named twice on one inject',
      (s) => { s.injects[1]!.teams = ['comms', 'comms'] },
      'injects[1].teams[1]: duplicate team "comms" (first at index 0)',
    ],
    ['a decision with neither choices nor free text', (s) => {
      delete s.injects[1]!.decision!.choices
      s.injects[1]!.decision!.freeText = false
    },
    'injects[1].decision: a decision needs choices, free text, or both'],
    ['an impact before the start', (s) => { s.clock.impactTime = '2030-12-31T00:00:00Z' },
      'clock.impactTime: impact time 2030-12-31T00:00:00Z must be after the scenario start 2031-01-01T00:00:00Z'],
    ['a duplicate site id', (s) => { s.sites.push({ ...s.sites[0]! }) }, 'sites[1].id: duplicate site id "port-a" (first at index 0)'],
  ]

  it.each(cases)('reports %s', (_, edit, expected) => {
    const s = structuredClone(parseMini())
    edit(s)
    const result = validateScenario(s)
    expect(result.ok ? [] : result.errors.map(e => `${e.path}: ${e.message}`)).toEqual([expected])
  })

  it('accepts an inject kind that the scenario declares', () => {
    const s = structuredClone(parseMini())
    s.injectKinds = ['field-report']
    s.injects[1]!.kind = 'field-report'
    expect(validateScenario(s).ok).toBe(true)
  })
})

describe('validateScenario and paths', () => {
  it('validates a plain object and reports paths without positions', () => {
    const s = structuredClone(parseMini()) as unknown as { teams: Array<{ colour: string }> }
    const team = s.teams[0]
    if (team) team.colour = 'blue'
    expect(validateScenario(s)).toEqual({ ok: false, errors: [{ path: 'teams[0].colour', message: 'a colour as #rrggbb' }] })
    expect(validateScenario(parseMini()).ok).toBe(true)
  })

  it('formats paths and errors', () => {
    expect(formatIssuePath(['injects', 4, 'teams', 0])).toBe('injects[4].teams[0]')
    expect(formatIssuePath([])).toBe('')
    expect(formatScenarioError({ path: 'injects[4].teams[0]', message: 'unknown team "ops"', line: 12, column: 5 }))
      .toBe('12:5 injects[4].teams[0]: unknown team "ops"')
  })
})
