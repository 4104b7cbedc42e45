import type { Content, TableCell, TDocumentDefinitions } from 'pdfmake/interfaces'
import type { ThreatSummary } from '#shared/geo/threat'
import { durationText } from '#shared/review/decisions'
import { FEEDBACK_MIN_GROUP } from '#shared/review/feedback'
import { FINDING_KIND_LABELS, ITEM_STATUS_LABELS, POETE_LABELS, RATING_LABELS, RATINGS } from '#shared/review/plan'
import { pdfSafe } from '#shared/review/pdftext'
import { ROLE_LABELS, type ExerciseRole } from '#shared/utils/roles'
import { threatChartSvg } from './chart'
import type { ReportData } from './data'
import {
  keepHeadingsWithText, paragraphs, PDF_INK, pdfDocument, pdfTable, pdfTime, pdfWallTime, pt, ratingCell, sectionHeading, setPdfZone,
} from './layout'

type R = ReportData

/**
 * The map SVG as svg-to-pdfkit can draw it: it ignores paint-order, so a label's white halo would
 * cover its letters; each haloed label becomes a halo copy under a plain copy. Text outside the
 * embedded fonts' subset is written out (pdfSafe).
 */
export function pdfMapSvg(svg: string): string {
  return pdfSafe(svg).replace(
    /<text([^>]*?) stroke="([^"]+)" stroke-width="3" stroke-linejoin="round" paint-order="stroke">([^<]*)<\/text>/g,
    (_m, attrs: string, halo: string, body: string) => `<text${attrs.replace(/ fill="[^"]*"/, ` fill="${halo}"`)} stroke="${halo}" stroke-width="3" stroke-linejoin="round">${body}</text><text${attrs}>${body}</text>`,
  )
}

// svg-to-pdfkit opens SVG fonts (pdfmake passes `options` on to it; its types omit them) by file name outside pdfmake's
// virtual files; the text then keeps the Plex face already in use, so that warning is noise.
const SVG_OPTIONS = { warningCallback: (m: string) => { if (!m.includes('failed to open font')) console.warn(m) } }

const fmtPct = (x: number | null) => (x === null ? '—' : `${Math.round(x * 100)} %`)
const STATUS_TEXT = { 'on-time': 'on time', 'late': 'late', 'missed': 'missed', 'pending': 'pending' } as const
const kappaText = (k: number | null) => (k === null ? 'undefined' : k.toFixed(2))

function cover(d: R): Content[] {
  const rows: Array<[string, string]> = [
    ['Exercise', d.exercise.title],
    ['Scenario', `${d.scenario.title} (${d.scenario.key})`],
    ['Drill run (wall clock)', `${pdfWallTime(d.exercise.startedAt)} to ${d.exercise.endedAt ? pdfWallTime(d.exercise.endedAt) : 'not ended'}`],
    ['Scenario time', `${pdfTime(d.scenario.clock.scenarioStart)} to impact ${pdfTime(d.scenario.clock.impactTime)}`],
    ['Participants', `${d.participants.total} members`],
    ['Record', `${d.eventCount} events`],
    ['Report drawn up', pdfWallTime(d.generatedAt)],
    ['Scenario time zone', d.scenario.clock.timeZone ?? 'UTC'],
  ]
  return [
    { text: 'After-action report', fontSize: 28, bold: true, color: PDF_INK.heading, margin: [0, 60, 0, 4] },
    { text: pt(d.exercise.title), fontSize: 18, margin: [0, 0, 0, 18] },
    { table: { widths: ['*'], body: [[{ text: d.drill.marking, alignment: 'center', bold: true, fontSize: 20, characterSpacing: 3, fillColor: PDF_INK.marking, color: PDF_INK.markingText, margin: [0, 10, 0, 10] }], [{ text: pt(d.drill.caution), alignment: 'center', fontSize: 10, fillColor: PDF_INK.caution, margin: [10, 6, 10, 6] }]] }, layout: 'noBorders', margin: [0, 0, 0, 20] },
    { table: { widths: [130, '*'], body: rows.map(([k, v]) => [{ text: k, bold: true, fontSize: 9, color: PDF_INK.muted }, { text: pt(v), fontSize: 9 }]) }, layout: 'lightHorizontalLines' },
    { text: 'This report is drawn from the exercise record (every clock change, release, response, rating and observation) and from the review desk: findings, hotwash notes, participant feedback and the improvement plan.', style: 'muted', margin: [0, 8, 0, 14] },
    { toc: { title: { text: 'Contents', style: 'h2' }, textStyle: { fontSize: 9 } } },
  ]
}

/** "1 evaluator", "3 evaluators". */
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`
const EXERCISE_STATUS_TEXT: Record<string, string> = { planned: 'not started', running: 'running', paused: 'paused', ended: 'ended' }

function overview(d: R): Content[] {
  return [
    sectionHeading(1, 'Overview', true),
    // A description copied from the scenario summary is not repeated here (section 3 has it).
    ...(d.scenario.summary.startsWith(d.exercise.description.slice(0, 200)) ? [] : paragraphs(d.exercise.description)),
    { text: pt(`${d.exercise.title} ran ${d.exercise.startedAt ? `from ${pdfWallTime(d.exercise.startedAt)}` : '(never started)'}${d.exercise.endedAt ? ` to ${pdfWallTime(d.exercise.endedAt)}` : ''} on the wall clock, playing the scenario "${d.scenario.title}" from ${pdfTime(d.scenario.clock.scenarioStart)} towards an impact at ${pdfTime(d.scenario.clock.impactTime)}. The record holds ${d.eventCount} events; ${plural(d.decisions.rows.length, 'decision was', 'decisions were')} asked of the teams and ${plural(d.scoring.evaluators.length, 'evaluator', 'evaluators')} rated critical tasks. Status when this report was drawn up: ${EXERCISE_STATUS_TEXT[d.exercise.status] ?? d.exercise.status}.`), style: 'para' },
    { text: 'Participants by role and team', style: 'h2' },
    pdfTable(['Role', 'Team', 'People'], d.participants.groups.map(g => [g.roleLabel, g.teamName ?? '—', g.people.join(', ')]), [90, 150, '*']),
  ]
}

function objectives(d: R): Content[] {
  return [
    sectionHeading(2, 'Objectives'),
    ...d.scenario.objectives.flatMap((o, i): Content[] => [
      { text: pt(`${i + 1}. ${o.title}`), style: 'h3' },
      { text: pt(o.description.replace(/\s*\n\s*/g, ' ').trim()), style: 'para' },
      { text: pt(`Capabilities: ${o.capabilities.join('; ')}`), style: 'muted', margin: [0, 0, 0, 6] },
    ]),
  ]
}

function scenarioSummary(d: R): Content[] {
  return [
    sectionHeading(3, 'Scenario summary'),
    ...paragraphs(d.scenario.summary),
    { text: pt(`Phases: ${d.scenario.phases.map(p => p.title).join(' · ')}. Teams: ${d.scenario.teams.map(t => t.name).join(' · ')}. ${d.scenario.injectCount} injects and ${d.scenario.solutionCount} orbit solutions in the script.`), style: 'muted' },
  ]
}

function threatSection(d: R): Content[] {
  const final = d.threat.at(-1)
  const out: Content[] = [sectionHeading(4, 'How the threat evolved', true)]
  if (!final) return [...out, { text: 'No orbit solution was published during this drill.', style: 'para' }]
  out.push({ text: pt(`The last published solution, ${final.label}, gave an impact probability of ${final.probabilityText} (${final.odds}), Torino ${final.torino}, an energy of ${final.energyText} and a diameter of ${final.diameterText}, for an impact at ${pdfTime(final.impactTime)}.`), style: 'para' })
  if (d.map) out.push({ svg: pdfMapSvg(d.map), width: 515, options: SVG_OPTIONS, margin: [0, 4, 0, 2] } as Content, { text: 'The risk corridor of the last published solution (filled) with the earlier corridors (dashed), the impact points of its realisations, blast rings of the median case and the run-up class of each site.', style: 'muted', margin: [0, 0, 0, 8] })
  out.push(
    { svg: threatChartSvg(d.threat.map(s => ({ label: s.label.split(' — ')[0] ?? s.label, impactProbability: s.impactProbability, torino: s.torino }))), width: 515, options: SVG_OPTIONS, margin: [0, 4, 0, 6] } as Content,
    pdfTable(
      ['Solution', 'Published (scenario)', 'Impact probability', 'Torino', 'Energy at entry (median, 5–95 %)', 'Diameter', 'Tsunami'],
      d.threat.map(s => [s.label, pdfTime(s.publishedAt), `${s.probabilityText} (${s.odds})`, String(s.torino), s.energyText, s.diameterText, fmtPct(s.tsunamiProbability)]),
      ['*', 62, 62, 32, 80, 62, 38], { fontSize: 7.5 },
    ),
  )
  if (d.hazard) out.push(...finalHazardPdf(d.hazard))
  return out
}

/** The last solution's energies, tsunami band per coastal site (with the laws named) and heat. */
function finalHazardPdf(h: ThreatSummary): Content[] {
  const out: Content[] = [
    { text: pt(`Figures of the last published solution, ${h.label}`), style: 'h2' },
    { text: 'Every figure assumes the object strikes: a median with its 5–95 % range over the realisations.', style: 'muted',
      margin: [0, 0, 0, 4] },
    pdfTable(['Energy', 'Median (5–95 %)', 'What it is'], h.energies.map(e => [e.label, e.text, e.note]), [110, 150, '*']),
    { text: pt(`Airbursts: ${h.airburstText} of impacts.`), style: 'para' },
    { text: 'Tsunami at the coastal sites', style: 'h3' },
    { text: pt(h.bandNote), style: 'para' },
    { text: 'Each cell: the median, with the 5–95 % range in brackets (indicative).', style: 'muted', margin: [0, 0, 0, 2] },
  ]
  if (!h.coast.length) out.push({ text: 'No realisation sends a wave to a coastal site.', style: 'para' })
  else if (h.coast.some(c => c.band)) {
    out.push(pdfTable(
      ['Site', 'Distance', 'Run-up, low law', 'Run-up, high law', 'Offshore wave, low law', 'Offshore wave, high law'],
      h.coast.map(c => [
        c.name, c.distanceText, c.band?.low.runUpText ?? c.runUpText, c.band?.high.runUpText ?? '—',
        c.band?.low.amplitudeText ?? '—', c.band?.high.amplitudeText ?? '—',
      ]),
      ['*', 62, 78, 78, 78, 78], { fontSize: 7.5 },
    ))
  }
  else {
    out.push(pdfTable(['Site', 'Distance', 'Run-up (indicative)'], h.coast.map(c => [c.name, c.distanceText, c.runUpText]), ['*', 80, 160]))
  }
  if (h.laws.length) {
    out.push({ text: 'The published source laws', style: 'muted', bold: true, margin: [0, 0, 0, 2] })
    const law = (l: ThreatSummary['laws'][number]) => ({ text: pt(`${l.key === 'low' ? 'Low' : 'High'} law, ${l.name}: ${l.source}`),
      style: 'muted' })
    out.push({ ul: h.laws.map(law), margin: [0, 0, 0, 6] })
  }
  const cells = h.heat.length ? ' Thermal exposure: median (5–95 %).' : ''
  out.push({ text: 'Heat at the sites', style: 'h3' }, { text: pt(`${h.heatText}${cells}`), style: 'para' })
  if (h.heat.length) {
    out.push(pdfTable(
      ['Site', 'Thermal exposure', 'First-degree burns', 'Second-degree burns', 'Third-degree burns'],
      h.heat.map(r => [r.name, r.thermalText, r.burn1, r.burn2, r.burn3]), ['*', 130, 70, 70, 70], { fontSize: 7.5 },
    ))
  }
  return out
}

function timeline(d: R): Content[] {
  return [
    sectionHeading(5, 'Timeline (condensed)', true),
    { text: `${d.timeline.length} of the ${d.eventCount} events of the record: the clock, orbit solutions, releases and messages. Responses, ratings and observations follow in their own sections; the full record is in the timeline export (CSV, XLSX, JSON).`, style: 'muted', margin: [0, 0, 0, 4] },
    pdfTable(['#', 'Scenario time', 'Wall time', 'Event', 'Teams'], d.timeline.map(r => [String(r.seq), pdfTime(r.scenarioTime), pdfWallTime(r.wallTime, false), r.summary, r.teams || 'all']), [18, 82, 64, '*', 110], { fontSize: 7.5 }),
  ]
}

function decisions(d: R): Content[] {
  const team = (k: string) => d.scenario.teams.find(t => t.key === k)?.name ?? k
  const phase = (k: string) => d.scenario.phases.find(p => p.key === k)?.title ?? k
  const groupRows = (gs: R['decisions']['byTeam'], name: (k: string) => string): TableCell[][] => gs.map(g => [name(g.key), String(g.decisions), String(g.answered), String(g.onTime), String(g.late), String(g.missed + g.pending), durationText(g.medianMin), durationText(g.medianWallMin)])
  const head = ['', 'Decisions', 'Answered', 'On time', 'Late', 'Unanswered', 'Median (scenario)', 'Median (wall)']
  const widths = ['*', 44, 44, 38, 30, 52, 62, 56]
  return [
    sectionHeading(6, 'Decisions and response times', true),
    { text: 'For every inject that asked for a decision and every team it went to: the time from release to the team\'s first response, against the deadline in scenario time. Wall-clock times show how long the room took in the drill itself.', style: 'muted', margin: [0, 0, 0, 4] },
    { text: 'By team', style: 'h2' }, pdfTable(['Team', ...head.slice(1)], groupRows(d.decisions.byTeam, team), widths),
    { text: 'By phase', style: 'h2' }, pdfTable(['Phase', ...head.slice(1)], groupRows(d.decisions.byPhase, phase), widths),
    { text: 'Each decision', style: 'h2' },
    pdfTable(['Team', 'Released', 'Deadline', 'First response', 'Took', 'Of time allowed', 'Status'], d.decisions.rows.flatMap((r): TableCell[][] => [
      [{ text: pt(r.title), bold: true, fontSize: 8, colSpan: 7, margin: [0, 3, 0, 0] }, '', '', '', '', '', ''],
      [team(r.teamKey), r.releaseLagMin === null ? pdfTime(r.releasedAt) : { stack: [pdfTime(r.releasedAt), { text: r.releaseLagMin < 0 ? `${durationText(-r.releaseLagMin)} early, by hand` : `${durationText(r.releaseLagMin)} late`, color: PDF_INK.U }] }, pdfTime(r.deadline), r.first ? `${pdfTime(r.first.scenarioTime)} by ${r.first.by}` : '—', durationText(r.responseMin), fmtPct(r.shareOfAllowed),
        { text: STATUS_TEXT[r.status], bold: true, fontSize: 7.5, color: r.status === 'on-time' ? PDF_INK.P : r.status === 'pending' ? PDF_INK.muted : PDF_INK.U }],
      ...(r.first && (r.first.choice || r.first.text) ? [[{ text: pt(`${r.first.choice ?? ''}${r.first.choice && r.first.text ? ' — ' : ''}${r.first.text}`.slice(0, 600)), fontSize: 7.5, color: PDF_INK.muted, colSpan: 7 }, '', '', '', '', '', ''] as TableCell[]] : []),
      ...(r.first && r.first.injectRevision < r.revision
        ? [[{ text: `Answered ${r.first.injectRevision === 0 ? 'the message as released' : `revision ${r.first.injectRevision}`}; its figures were revised after (now revision ${r.revision}).`, fontSize: 7.5, color: PDF_INK.U, colSpan: 7 }, '', '', '', '', '', ''] as TableCell[]]
        : []),
    ]), [110, 72, 72, '*', 44, 40, 44], { fontSize: 7.5, groupRows: true }),
  ]
}

/** The protective-action zones the teams and control drew, with their figures when drawn and at the end. */
function zones(d: R): Content[] {
  const out: Content[] = [{ text: 'Protective-action zones', style: 'h2' }]
  if (!d.zones.length) return [...out, { text: 'No zone was drawn during this drill.', style: 'para' }]
  out.push({ text: 'Zones drawn on the hazard map. Chances are conditional on impact: the share of sampled impacts whose damage reaches beyond the zone.', style: 'muted', margin: [0, 0, 0, 4] })
  out.push(pdfTable(['Zone', 'Drawn (scenario)', 'Figures'], d.zones.map(z => [
    { stack: [{ text: pt(`${z.kind}: ${z.name}`), bold: true, fontSize: 8 }, { text: pt(`${z.team} · ${z.by}`), fontSize: 7, color: PDF_INK.muted }, { text: pt(z.shape), fontSize: 7, color: PDF_INK.muted }] },
    { stack: [pdfTime(z.drawnAt), ...(z.withdrawnAt ? [{ text: `withdrawn ${pdfTime(z.withdrawnAt)}`, color: PDF_INK.U }] : [])] },
    { stack: [
      ...(z.note ? [{ text: pt(z.note), fontSize: 7.5, italics: true }] : []),
      { text: pt(`When drawn: ${z.whenDrawn}`), fontSize: 7.5 },
      ...(z.atEnd ? [{ text: pt(`Against the last solution: ${z.atEnd}`), fontSize: 7.5 }] : []),
    ] },
  ]), [120, 70, '*'], { fontSize: 7.5 }))
  return out
}

function scores(d: R): Content[] {
  const s = d.scoring
  const out: Content[] = [
    sectionHeading(7, 'Scores by objective and capability', true),
    { text: RATINGS.map(r => `${r}: ${RATING_LABELS[r]}`).join('   ·   '), style: 'muted', margin: [0, 0, 0, 6] },
  ]
  for (const o of s.objectives) {
    out.push({ columns: [{ text: pt(o.title), style: 'h2', width: '*' }, { text: `${o.counts.P} P · ${o.counts.S} S · ${o.counts.M} M · ${o.counts.U} U`, style: 'muted', width: 'auto', margin: [0, 12, 0, 0] }] })
    for (const c of o.capabilities) {
      const rows: TableCell[][] = c.criteria.flatMap(cr => cr.tasks.flatMap(t => (t.ratings.length
        ? t.ratings.map((r, i) => [i === 0 ? { text: pt(t.text), fontSize: 8, rowSpan: t.ratings.length } : '', r.by.name, ratingCell(r.rating), r.note || '—'])
        : [[{ text: pt(t.text), fontSize: 8 }, { text: 'not rated', color: PDF_INK.muted, fontSize: 8 }, ratingCell(null), '']])))
      out.push({ text: pt(`${c.name}${c.summary ? ` — most frequent rating ${c.summary}` : ''}`), style: 'h3' })
      if (rows.length) out.push(pdfTable(['Critical task', 'Evaluator', 'Rating', 'Note'], rows, ['*', 80, 32, 150], { fontSize: 8 }))
      else out.push({ text: 'No criteria for this capability.', style: 'muted', margin: [0, 0, 0, 4] })
    }
  }
  out.push({ text: 'Agreement between evaluators', style: 'h2' })
  if (!s.agreement.length) out.push({ text: 'No two evaluators rated the same task, so agreement cannot be measured.', style: 'para' })
  else {
    out.push(
      { text: 'Cohen\'s kappa (Cohen 1960) over the tasks both evaluators rated: 1 is full agreement, 0 is what chance alone would give. Reading after Landis & Koch (1977).', style: 'muted', margin: [0, 0, 0, 4] },
      pdfTable(['Evaluators', 'Tasks rated by both', 'Observed agreement', 'Expected by chance', 'Cohen\'s kappa', 'Reading'], s.agreement.map(p => [`${p.a.name} and ${p.b.name}`, String(p.n), fmtPct(p.observed), fmtPct(p.expected), kappaText(p.kappa), p.strength ?? '—']), ['*', 60, 60, 60, 50, 70]),
    )
  }
  out.push({ text: 'Disagreements for the hotwash', style: 'h2' })
  if (!s.disagreements.length) out.push({ text: 'The evaluators rated no task differently.', style: 'para' })
  else out.push(pdfTable(['Task', 'Ratings and notes'], s.disagreements.map(x => [{ stack: [{ text: pt(x.taskText), fontSize: 8 }, { text: pt(x.capability), fontSize: 7, color: PDF_INK.muted }] }, { stack: x.ratings.map(r => ({ text: pt(`${r.rating} by ${r.by.name}${r.note ? `: ${r.note}` : ''}`), fontSize: 8 })) }]), ['*', 240]))
  return out
}

function observations(d: R): Content[] {
  const team = (k: string | null) => (k ? d.scenario.teams.find(t => t.key === k)?.name ?? k : '—')
  const obs = d.scoring.observations
  return [
    sectionHeading(8, 'Observations'),
    obs.length
      ? pdfTable(['Scenario time', 'By', 'Team', 'Inject', 'Observation'], obs.map(o => [pdfTime(o.scenarioTime), o.by.name, team(o.teamKey), o.injectKey ?? '—', o.text]), [70, 70, 70, 70, '*'], { fontSize: 8 })
      : { text: 'The evaluators recorded no observations.', style: 'para' },
  ]
}

function hotwashAndFeedback(d: R): Content[] {
  const f = d.feedback
  const out: Content[] = [sectionHeading(9, 'Hotwash and participant feedback', true)]
  for (const s of d.hotwash) {
    out.push({ text: s.title, style: 'h2' }, ...(s.body.trim() ? paragraphs(s.body) : [{ text: 'Nothing written.', style: 'muted' } as Content]))
  }
  out.push({ text: 'Participant feedback', style: 'h2' }, { text: `${f.responses} ${f.responses === 1 ? 'response' : 'responses'}${f.invited ? ` from ${f.invited} members asked` : ''}. Ratings from 1 (strongly disagree) to 5 (strongly agree); comments in groups of at least ${FEEDBACK_MIN_GROUP} people, without names or times${f.commentsWithheld ? ` (${f.commentsWithheld} held back until ${FEEDBACK_MIN_GROUP} people have written one)` : ''}.`, style: 'muted', margin: [0, 0, 0, 4] })
  out.push(pdfTable(['Statement', 'Answers', 'Mean', '1', '2', '3', '4', '5'], f.questions.map(q => [q.text, String(q.n), q.mean === null ? '—' : q.mean.toFixed(1), ...q.counts.map(String)]), ['*', 40, 30, 18, 18, 18, 18, 18]))
  const team = (k: string | null) => (k ? d.scenario.teams.find(t => t.key === k)?.name ?? k : null)
  for (const c of f.comments) {
    const who = c.role
      ? `${ROLE_LABELS[c.role as ExerciseRole]}s${team(c.teamKey) ? `, ${team(c.teamKey)}` : c.role === 'player' ? ', several teams' : ''}`
      : 'All who wrote'
    out.push({ stack: [
      { text: pt(`${who} (${c.people})`), bold: true, fontSize: 8.5 },
      ...(c.wentWell.length ? [{ text: 'Went well', bold: true, fontSize: 8.5 }, { ul: c.wentWell.map(pt), fontSize: 8.5 }] : []),
      ...(c.toImprove.length ? [{ text: 'To improve', bold: true, fontSize: 8.5 }, { ul: c.toImprove.map(pt), fontSize: 8.5 }] : []),
    ], margin: [0, 2, 0, 6] } as Content)
  }
  return out
}

function findings(d: R): Content[] {
  const objective = (k: string) => d.scenario.objectives.find(o => o.key === k)?.title ?? k
  const out: Content[] = [sectionHeading(10, 'Findings', true)]
  for (const kind of ['strength', 'improvement'] as const) {
    const list = d.findings.filter(f => f.kind === kind)
    out.push({ text: kind === 'strength' ? 'Strengths' : 'Areas for improvement', style: 'h2' })
    if (!list.length) out.push({ text: `No ${FINDING_KIND_LABELS[kind].toLowerCase()} recorded.`, style: 'muted' })
    for (const f of list) {
      out.push({ text: pt(f.title), style: 'h3' }, { text: pt(`${objective(f.objectiveKey)} — ${f.capability}`), style: 'muted' }, ...paragraphs(f.detail))
    }
  }
  return out
}

function plan(d: R): Content[] {
  const finding = (id: string | null) => (id ? d.findings.find(f => f.id === id)?.title ?? null : null)
  return [
    sectionHeading(11, 'Improvement plan'),
    d.improvements.length
      ? pdfTable(['Corrective action', 'Capability', 'Element', 'Owner', 'Start', 'Due', 'Status'], d.improvements.map(i => [
          { stack: [{ text: pt(i.action), fontSize: 8 }, ...(finding(i.findingId) ? [{ text: pt(`Answers: ${finding(i.findingId)}`), fontSize: 7, color: PDF_INK.muted }] : [])] },
          i.capability, POETE_LABELS[i.element], i.owner, i.startDate, i.dueDate, ITEM_STATUS_LABELS[i.status],
        ]), ['*', 80, 50, 70, 48, 48, 46], { fontSize: 8 })
      : { text: 'No improvement items yet.', style: 'para' },
  ]
}

/**
 * The after-action report as a pdfmake document (the app's IBM Plex fonts; marking, caution and page numbers on every
 * page). Pure: a worker thread renders it (reportPdf).
 */
export function reportDocument(d: ReportData): TDocumentDefinitions {
  setPdfZone(d.scenario.clock.timeZone)
  const content: Content[] = [
    ...cover(d), ...overview(d), ...objectives(d), ...scenarioSummary(d), ...threatSection(d), ...timeline(d),
    ...decisions(d), ...zones(d), ...scores(d), ...observations(d), ...hotwashAndFeedback(d), ...findings(d), ...plan(d),
  ]
  return pdfDocument(`After-action report: ${d.exercise.title}`, pdfSafe(`After-action report — ${d.exercise.title}`), content, { pageBreakBefore: keepHeadingsWithText })
}
