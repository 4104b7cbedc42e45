// A drill played through the live API on a compressed clock: the scheduler, manual releases, holds,
// contingencies, solution publications with revised injects, responses, scores and desk snapshots.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeSockets, ikey, liveSocket, newLiveExercise, ready, until, type LiveCast, type LiveSocket } from '../support/live'

let cast: LiveCast
let socks: Record<'control' | 'science' | 'civil' | 'comms' | 'evaluator', LiveSocket>
const url = (path: string) => `/api/exercises/${cast.id}${path}`
const clock = (body: Record<string, unknown>) => cast.facilitator.client.post(url('/clock'), body)
const released = (s: LiveSocket, key: string) => s.events.find(e => (e.type === 'inject.released' || e.type === 'message.sent') && e.data.key === key)

beforeAll(async () => {
  cast = await newLiveExercise('Drill on a compressed clock')
  socks = {
    control: liveSocket(cast.facilitator.client.cookieHeader, { exerciseId: cast.id }),
    science: liveSocket(cast.science.client.cookieHeader, { exerciseId: cast.id }),
    civil: liveSocket(cast.civil.client.cookieHeader, { exerciseId: cast.id }),
    comms: liveSocket(cast.comms.client.cookieHeader, { exerciseId: cast.id }),
    evaluator: liveSocket(cast.evaluator.client.cookieHeader, { exerciseId: cast.id }),
  }
  await Promise.all(Object.values(socks).map(ready))
})

afterAll(async () => {
  closeSockets()
  if (cast) await clock({ action: 'end' })
})

describe('the clock', () => {
  it('starts a planned exercise at the scenario start with the scenario\'s default speed', async () => {
    const res = await clock({ action: 'start' })
    expect(res.status).toBe(200)
    expect(res.json.clock).toMatchObject({ status: 'running', paused: false, scenarioAnchor: '2031-03-03T21:00:00.000Z' })
    // 198 scenario days (10 of aftermath) in 210 wall minutes
    expect(res.json.clock.factor).toBeCloseTo((Date.parse('2031-09-18T04:17:26Z') - Date.parse('2031-03-03T21:00:00Z')) / (210 * 60_000), 3)
    await until(() => socks.science.events.find(e => e.type === 'clock.changed'), 5000, 'clock event at the science room')
  })

  it('refuses to start twice and to jump backwards (409)', async () => {
    expect((await clock({ action: 'start' })).status).toBe(409)
    const back = await clock({ action: 'jump', to: '2031-03-01T00:00:00Z' })
    expect(back.status).toBe(409)
  })

  it('pauses and resumes, keeping the scenario time across the pause', async () => {
    const paused = await clock({ action: 'pause' })
    expect(paused.json.clock.paused).toBe(true)
    await new Promise(r => setTimeout(r, 200))
    const resumed = await clock({ action: 'resume' })
    expect(resumed.json.clock.paused).toBe(false)
    expect(resumed.json.clock.scenarioAnchor).toBe(paused.json.clock.scenarioAnchor)
  })
})

describe('releases', () => {
  it('jumps to the next inject and releases it to the science room only, without expected actions', async () => {
    await clock({ action: 'speed', factor: 1 })
    const res = await clock({ action: 'jump', toNextInject: true })
    expect(res.status).toBe(200)
    expect(res.json.clock.scenarioAnchor).toBe('2031-03-04T02:10:00.000Z')
    const sci = await until(() => released(socks.science, 'survey-candidate'), 5000, 'survey-candidate at science')
    expect(sci.data.expectedActions).toBeUndefined()
    expect(sci.data.drill.marking).toMatch(/EXERCISE/)
    const ev = await until(() => released(socks.evaluator, 'survey-candidate'), 5000, 'survey-candidate at evaluators')
    expect(ev.data.expectedActions.length).toBeGreaterThan(0)
    await until(() => released(socks.control, 'survey-candidate'), 5000, 'survey-candidate at control')
    await new Promise(r => setTimeout(r, 300))
    expect(released(socks.civil, 'survey-candidate')).toBeUndefined()
    expect(released(socks.comms, 'survey-candidate')).toBeUndefined()
  })

  it('publishes the first solution before the data release that presents it, with figures filled in', async () => {
    await clock({ action: 'jump', to: '2031-03-04T06:45:00Z' })
    const listing = await until(() => released(socks.science, 'first-risk-listing'), 10_000, 'first-risk-listing')
    const s1 = socks.science.events.find(e => e.type === 'solution.published' && e.data.key === 's1-discovery')!
    expect(s1.seq).toBeLessThan(listing.seq)
    expect(s1.data.assessment.options.samples).toBe(20_000)
    expect(s1.data.headline.drill.caution).toMatch(/training/)
    expect(listing.data.body).not.toContain('{{')
    expect(listing.data.body).toMatch(/Impact probability on 8 September 2031: \*\*[\d.<]+ ?%\*\*/)
    expect(listing.data.solutionKey).toBe('s1-discovery')
  })

  it('releases an inject early by hand, once: again → 409, and the scheduler does not repeat it', async () => {
    const first = await cast.facilitator.client.post(url('/injects/notify-civil-protection/release'))
    expect(first.status).toBe(201)
    expect(first.json.event.data).toMatchObject({ key: 'notify-civil-protection', manual: true })
    const again = await cast.facilitator.client.post(url('/injects/notify-civil-protection/release'))
    expect(again.status).toBe(409)
    expect(again.json.data.seq).toBe(first.json.event.seq)
  })

  it('holds an inject past its time; the facilitator releases it later by hand', async () => {
    expect((await cast.facilitator.client.post(url('/injects/duty-officer-heads-up/hold'))).status).toBe(201)
    expect((await cast.facilitator.client.post(url('/injects/duty-officer-heads-up/hold'))).status).toBe(200)
    await clock({ action: 'jump', to: '2031-03-04T17:00:00Z' })
    await new Promise(r => setTimeout(r, 600))
    expect(released(socks.civil, 'duty-officer-heads-up')).toBeUndefined()
    const desk = await cast.facilitator.client.get(url('/live'))
    expect(desk.json.schedule.find((i: { key: string }) => i.key === 'duty-officer-heads-up').state).toBe('held')
    expect(socks.control.events.some(e => e.type === 'inject.held')).toBe(true)
    expect(socks.evaluator.events.some(e => e.type === 'inject.held')).toBe(false)
    const rel = await cast.facilitator.client.post(url('/injects/duty-officer-heads-up/release'))
    expect(rel.status).toBe(201)
    const civil = await until(() => released(socks.civil, 'duty-officer-heads-up'), 5000, 'held inject at civil')
    expect(civil.data.wasHeld).toBe(true)
  })

  it('releases on time under a compressed clock (one scenario hour in half a second)', async () => {
    await clock({ action: 'jump', to: '2031-03-06T12:00:00Z' })
    await clock({ action: 'speed', factor: 7200 })
    const t0 = Date.now()
    const e = await until(() => released(socks.comms, 'blogger-risk-table'), 5000, 'blogger-risk-table')
    const waited = Date.now() - t0
    expect(waited).toBeGreaterThan(350)
    expect(waited).toBeLessThan(2000)
    const late = Date.parse(e.scenarioTime) - Date.parse('2031-03-06T13:00:00Z')
    expect(late).toBeGreaterThanOrEqual(0)
    expect(late).toBeLessThan(30 * 60_000)
    await clock({ action: 'speed', factor: 1 })
  })

  it('leaves a contingency inject for the facilitator, who may release it', async () => {
    await clock({ action: 'jump', to: '2031-03-24T08:30:00Z' })
    await clock({ action: 'jump', to: '2031-05-28T00:00:00Z' })
    await until(() => released(socks.science, 'spectrum-release'), 15_000, 'spectrum-release')
    await new Promise(r => setTimeout(r, 400))
    expect(released(socks.science, 'contingency-deflection')).toBeUndefined()
    const desk = await cast.facilitator.client.get(url('/live'))
    const row = desk.json.schedule.find((i: { key: string }) => i.key === 'contingency-deflection')
    expect(row).toMatchObject({ state: 'due', contingency: expect.stringMatching(/deflection/) })
    expect((await cast.facilitator.client.post(url('/injects/contingency-deflection/release'))).status).toBe(201)
    const sci = await until(() => released(socks.science, 'contingency-deflection'), 5000, 'contingency at science')
    expect(sci.data.contingency).toBeUndefined()
    expect(released(socks.control, 'contingency-deflection')?.data.contingency.condition).toMatch(/deflection/)
  })
})

describe('revisions', () => {
  it('revises released injects that follow the current solution, not those that present their own', async () => {
    const events = socks.science.events
    const listing = released(socks.science, 'first-risk-listing')!
    const notify = released(socks.science, 'notify-civil-protection')!
    expect(events.filter(e => e.type === 'inject.revised' && e.data.key === 'first-risk-listing')).toEqual([])
    const revisions = events.filter(e => e.type === 'inject.revised' && e.data.key === 'notify-civil-protection')
    expect(revisions.length).toBeGreaterThan(0)
    const last = revisions.at(-1)!
    expect(last.data.solutionKey).toBe('s4-spectrum')
    expect(last.data.body).not.toBe(notify.data.body)
    expect(listing.data.solutionKey).toBe('s1-discovery')
    const room = await cast.science.client.get(url('/live'))
    const item = room.json.injects.find((i: { key: string }) => i.key === 'notify-civil-protection')
    expect(item.revisions.length).toBe(revisions.length + 1)
    expect(item.body).toBe(last.data.body)
    expect(item.revision).toBe(last.data.revision)
  })

  it('refuses to publish a solution twice (409)', async () => {
    const res = await cast.facilitator.client.post(url('/solutions/s1-discovery/publish'))
    expect(res.status).toBe(409)
  })
})

describe('responses, messages, scores', () => {
  it('takes a response once per idempotency key and shows it to the team and staff only', async () => {
    const body = {
      injectKey: 'notify-civil-protection',
      choice: 'Informal heads-up to the Directorate\'s duty officer today',
      text: 'Calling the duty officer.',
      idempotencyKey: ikey(),
    }
    const first = await cast.science.client.post(url('/responses'), body)
    expect(first.status).toBe(201)
    const second = await cast.science.client.post(url('/responses'), body)
    expect(second.status).toBe(200)
    expect(second.json.event.seq).toBe(first.json.event.seq)
    await until(() => socks.evaluator.events.find(e => e.seq === first.json.event.seq), 5000, 'response at evaluators')
    const all = (await cast.facilitator.client.get(url('/events'))).json.events.filter((e: { type: string }) => e.type === 'response.submitted')
    expect(all).toHaveLength(1)
    expect(first.json.event.data.late).toBe(true)
    await new Promise(r => setTimeout(r, 200))
    expect(socks.civil.events.some(e => e.type === 'response.submitted')).toBe(false)
    const desk = await cast.facilitator.client.get(url('/live'))
    const row = desk.json.schedule.find((i: { key: string }) => i.key === 'notify-civil-protection')
    expect(row).toMatchObject({ state: 'answered', answered: { science: true } })
  })

  it('refuses a response to another team\'s inject (404) and a choice the inject does not offer (400)', async () => {
    const other = await cast.civil.client.post(
      url('/responses'),
      { injectKey: 'notify-civil-protection', text: 'x', idempotencyKey: ikey() },
    )
    expect(other.status).toBe(404)
    const bad = await cast.science.client.post(
      url('/responses'),
      { injectKey: 'notify-civil-protection', choice: 'Launch a rocket', text: '', idempotencyKey: ikey() },
    )
    expect(bad.status).toBe(400)
    expect(bad.json.data.issues[0].path).toBe('choice')
  })

  it('sends an ad-hoc message to two teams, once per idempotency key, with figures filled in', async () => {
    const body = {
      teams: ['civil', 'comms'],
      title: 'Check your phones',
      body: 'Current odds {{ impactProbability | odds }}.',
      idempotencyKey: ikey(),
    }
    const first = await cast.facilitator.client.post(url('/messages'), body)
    expect(first.status).toBe(201)
    expect((await cast.facilitator.client.post(url('/messages'), body)).json.event.seq).toBe(first.json.event.seq)
    const key = first.json.event.data.key
    const civil = await until(() => released(socks.civil, key), 5000, 'message at civil')
    expect(civil.data.body).toMatch(/^Current odds .+\.$/)
    expect(civil.data.body).not.toContain('{{')
    await until(() => released(socks.comms, key), 5000, 'message at comms')
    await new Promise(r => setTimeout(r, 200))
    expect(released(socks.science, key)).toBeUndefined()
  })

  it('records scores and observations for staff, never for players', async () => {
    const score = await cast.evaluator.client.post(
      url('/scores'),
      {
        criterionKey: 'notification-and-coordination',
        taskKey: 'notify-early',
        rating: 'S',
        note: 'Same day, informal.',
        idempotencyKey: ikey(),
      },
    )
    expect(score.status).toBe(201)
    const obs = await cast.facilitator.client.post(
      url('/observations'),
      { text: 'Science cell hesitated.', teamKey: 'science', injectKey: 'notify-civil-protection', idempotencyKey: ikey() },
    )
    expect(obs.status).toBe(201)
    await until(() => socks.control.events.find(e => e.seq === score.json.event.seq), 5000, 'score at control')
    await until(() => socks.evaluator.events.find(e => e.seq === obs.json.event.seq), 5000, 'observation at evaluators')
    await new Promise(r => setTimeout(r, 200))
    for (const s of [socks.science, socks.civil, socks.comms]) {
      expect(s.events.some(e => e.type === 'score.recorded' || e.type === 'observation.recorded')).toBe(false)
    }
    const evaluatorDesk = await cast.evaluator.client.get(url('/live'))
    expect(evaluatorDesk.json.scores).toHaveLength(1)
    expect(evaluatorDesk.json.observations).toHaveLength(1)
  })
})

describe('what each desk may read', () => {
  it('a player reads only its team\'s traffic, without expected actions or contingency conditions', async () => {
    for (const who of ['science', 'civil', 'comms'] as const) {
      const c = cast[who].client
      const desk = await c.get(url('/live'))
      expect(desk.status).toBe(200)
      expect(desk.json.view).toBe('player')
      expect(desk.json.injects.length).toBeGreaterThan(0)
      for (const i of desk.json.injects) expect(i.teams).toContain(who)
      const text = JSON.stringify(desk.json) + JSON.stringify((await c.get(url('/events'))).json)
      expect(text).not.toMatch(/expectedActions|"condition"|score\.recorded|observation\.recorded|inject\.held/)
      expect(desk.json.schedule).toBeUndefined()
    }
  })

  it('evaluators and the analyst read all released traffic with expected actions', async () => {
    for (const who of ['evaluator', 'analyst'] as const) {
      const desk = await cast[who].client.get(url('/live'))
      expect(desk.json.view).toBe('evaluator')
      const teams = new Set(desk.json.injects.flatMap((i: { teams: string[] }) => i.teams))
      expect([...teams].sort()).toEqual(['civil', 'comms', 'science'])
      expect(desk.json.injects.find((i: { key: string }) => i.key === 'survey-candidate').expectedActions.length).toBeGreaterThan(0)
    }
  })

  it('events?since=N returns only later events, in order', async () => {
    const all = (await cast.facilitator.client.get(url('/events'))).json
    const n = all.events[5].seq
    const later = (await cast.facilitator.client.get(url(`/events?since=${n}&limit=3`))).json
    expect(later.events.map((e: { seq: number }) => e.seq)).toEqual([n + 1, n + 2, n + 3])
    expect(later.more).toBe(true)
    const seqs = all.events.map((e: { seq: number }) => e.seq)
    expect(seqs).toEqual([...seqs].sort((a: number, b: number) => a - b))
    expect(new Set(seqs).size).toBe(seqs.length)
  })

  it('the sockets got every event the record shows them, each once', async () => {
    for (const who of ['science', 'civil', 'comms', 'evaluator'] as const) {
      const record = (await cast[who].client.get(url('/events'))).json.events.map((e: { seq: number }) => e.seq)
      await until(() => socks[who].events.length >= record.length, 5000, `${who} socket to catch up`)
      expect(socks[who].events.map(e => e.seq)).toEqual(record)
    }
  })
})
