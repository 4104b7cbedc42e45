import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { Client, mailTo } from '../support/client'
import { closeSockets, newLiveExercise, type LiveCast } from '../support/live'

let d: LiveCast
const url = (p = '') => `/api/exercises/${d.id}${p}`
const issuePaths = (res: { json: { data?: { issues?: Array<{ path: string }> } } }) => (res.json.data?.issues ?? []).map(i => i.path).sort()

const strength = {
  kind: 'strength',
  objectiveKey: 'shared-picture',
  capability: 'Operational Coordination',
  title: 'Same-day notification',
  detail: 'The science cell told the Directorate within hours.',
}
const area = {
  kind: 'improvement',
  objectiveKey: 'public-warning',
  capability: 'Public Information and Warning',
  title: 'Holding statement came late',
  detail: 'No pre-cleared template existed.',
}
const item = {
  objectiveKey: 'public-warning', capability: 'Public Information and Warning', action: 'Write and pre-clear a holding-statement template for impact threats',
  element: 'planning', owner: 'Joint Information Centre lead', startDate: '2031-10-01', dueDate: '2031-12-15',
}

beforeAll(async () => {
  d = await newLiveExercise('Review plan drill')
  const f = d.facilitator.client
  expect((await f.post(url('/clock'), { action: 'start' })).status).toBeLessThan(300)
  expect((await f.post(url('/clock'), { action: 'pause' })).status).toBeLessThan(300)
}, 120_000)
afterAll(() => closeSockets())

describe('findings', () => {
  it('are written by the analyst and the facilitator, read by evaluators, refused to players', async () => {
    const made = await d.analyst.client.post(url('/findings'), strength)
    expect(made.status).toBe(201)
    expect(made.json).toMatchObject(strength)
    expect((await d.facilitator.client.post(url('/findings'), area)).status).toBe(201)
    expect((await d.evaluator.client.post(url('/findings'), area)).status).toBe(403)
    expect((await d.science.client.post(url('/findings'), area)).status).toBe(403)
    expect((await d.science.client.get(url('/findings'))).status).toBe(403)
    expect((await new Client().post(url('/findings'), area)).status).toBe(401)
    const list = await d.evaluator.client.get(url('/findings'))
    expect(list.json.map((x: { title: string }) => x.title)).toEqual([strength.title, area.title])
  })

  it('answer a bad body with 400 and the fields at fault', async () => {
    const bad = await d.analyst.client.post(url('/findings'), { kind: 'triumph', objectiveKey: 'Not A Key', capability: '', title: '' })
    expect(bad.status).toBe(400)
    expect(issuePaths(bad)).toEqual(['capability', 'kind', 'objectiveKey', 'title'])
    const unknown = await d.analyst.client.post(url('/findings'), { ...area, objectiveKey: 'no-such-objective' })
    expect(unknown.status).toBe(400)
    expect(issuePaths(unknown)).toEqual(['objectiveKey'])
    const wrongCap = await d.analyst.client.post(url('/findings'), { ...area, capability: 'Mass Care Services' })
    expect(issuePaths(wrongCap)).toEqual(['capability'])
    // An evaluator is refused before the body is read: 403, not 400.
    expect((await d.evaluator.client.post(url('/findings'), { kind: 'triumph' })).status).toBe(403)
  })

  it('are edited and deleted', async () => {
    const [first] = (await d.analyst.client.get(url('/findings'))).json
    const edited = await d.analyst.client.patch(url(`/findings/${first.id}`), { title: 'Notification on the first day' })
    expect(edited.status).toBe(200)
    expect(edited.json.title).toBe('Notification on the first day')
    expect((await d.analyst.client.patch(url(`/findings/${first.id}`), {})).status).toBe(400)
    expect((await d.evaluator.client.patch(url(`/findings/${first.id}`), { title: 'x' })).status).toBe(403)
    const gone = await d.facilitator.client.delete(url(`/findings/${first.id}`))
    expect(gone.status).toBe(204)
    expect((await d.analyst.client.delete(url(`/findings/${first.id}`))).status).toBe(404)
  })
})

describe('the improvement plan', () => {
  it('adds an item tied to an area for improvement, edits it inline and deletes it', async () => {
    const areaRow = (await d.analyst.client.get(url('/findings'))).json.find((x: { kind: string }) => x.kind === 'improvement')
    const made = await d.analyst.client.post(url('/improvements'), { ...item, findingId: areaRow.id })
    expect(made.status).toBe(201)
    expect(made.json).toMatchObject({ ...item, status: 'open', findingId: areaRow.id })
    const status = await d.facilitator.client.patch(url(`/improvements/${made.json.id}`), { status: 'in-progress' })
    expect(status.status).toBe(200)
    expect(status.json.status).toBe('in-progress')
    const owner = await d.analyst.client.patch(url(`/improvements/${made.json.id}`), { owner: 'Regional press office' })
    expect(owner.json).toMatchObject({ owner: 'Regional press office', status: 'in-progress' })
    const second = await d.analyst.client.post(url('/improvements'), { ...item, action: 'Train two spokespeople', element: 'training' })
    expect(second.status).toBe(201)
    expect((await d.analyst.client.delete(url(`/improvements/${second.json.id}`))).status).toBe(204)
    const list = (await d.evaluator.client.get(url('/improvements'))).json
    expect(list.map((x: { action: string }) => x.action)).toEqual([item.action])
  })

  it('refuses bad items with field issues, and players and evaluators', async () => {
    const bad = await d.analyst.client.post(
      url('/improvements'),
      { ...item, element: 'luck', startDate: '2031-02-30', dueDate: 'soon', owner: ' ', status: 'maybe' },
    )
    expect(bad.status).toBe(400)
    expect(issuePaths(bad)).toEqual(['dueDate', 'element', 'owner', 'startDate', 'status'])
    const order = await d.analyst.client.post(url('/improvements'), { ...item, startDate: '2032-01-01', dueDate: '2031-12-01' })
    expect(issuePaths(order)).toEqual(['dueDate'])
    const strengthRow = await d.analyst.client.post(url('/findings'), strength)
    const toStrength = await d.analyst.client.post(url('/improvements'), { ...item, findingId: strengthRow.json.id })
    expect(issuePaths(toStrength)).toEqual(['findingId'])
    const [row] = (await d.analyst.client.get(url('/improvements'))).json
    // A patch is checked against the whole item: a due date before the stored start date is refused.
    expect(issuePaths(await d.analyst.client.patch(url(`/improvements/${row.id}`), { dueDate: '2031-09-01' }))).toEqual(['dueDate'])
    for (const who of [d.science, d.evaluator]) {
      expect((await who.client.post(url('/improvements'), item)).status).toBe(403)
      expect((await who.client.patch(url(`/improvements/${row.id}`), { status: 'done' })).status).toBe(403)
      expect((await who.client.delete(url(`/improvements/${row.id}`))).status).toBe(403)
    }
    expect((await d.science.client.get(url('/improvements'))).status).toBe(403)
  })
})

describe('hotwash notes', () => {
  it('are saved by section with a revision guard', async () => {
    const empty = (await d.evaluator.client.get(url('/hotwash'))).json
    expect(empty.map((s: { key: string }) => s.key)).toEqual(['summary', 'strengths', 'improvements', 'follow-up'])
    expect(empty[0]).toMatchObject({ body: '', revision: 0 })
    const saved = await d.analyst.client.put(url('/hotwash/strengths'), { body: 'Teams spoke to each other early.', revision: 0 })
    expect(saved.status).toBe(200)
    expect(saved.json).toMatchObject({ revision: 1, updatedBy: 'analyst member' })
    const stale = await d.facilitator.client.put(url('/hotwash/strengths'), { body: 'Overwrite', revision: 0 })
    expect(stale.status).toBe(409)
    expect(stale.json.data).toMatchObject({ body: 'Teams spoke to each other early.', revision: 1 })
    expect((await d.facilitator.client.put(url('/hotwash/strengths'), { body: 'Merged text.', revision: 1 })).json.revision).toBe(2)
    expect((await d.analyst.client.put(url('/hotwash/nonsense'), { body: 'x', revision: 0 })).status).toBe(400)
    expect((await d.evaluator.client.put(url('/hotwash/summary'), { body: 'x', revision: 0 })).status).toBe(403)
  })
})

describe('participant feedback', () => {
  const answers = {
    ratings: { objectives: 4, realism: 5, figures: 3, coordination: 2, pace: 4 },
    wentWell: 'The figures came with plain odds.',
    toImprove: 'Tell comms sooner.',
  }

  it('is asked for by e-mail once the drill has ended, with a link to the form', async () => {
    expect((await d.analyst.client.post(url('/feedback/request'), {})).status).toBe(409)
    expect((await d.facilitator.client.post(url('/clock'), { action: 'end' })).status).toBeLessThan(300)
    expect((await d.science.client.post(url('/feedback/request'), {})).status).toBe(403)
    const bad = await d.analyst.client.post(url('/feedback/request'), { userIds: [crypto.randomUUID()] })
    expect(issuePaths(bad)).toEqual(['userIds[0]'])
    const sent = await d.analyst.client.post(url('/feedback/request'), { message: 'Ten minutes, please.' })
    expect(sent.status).toBe(200)
    expect(sent.json.sent).toBe(5)
    const [mail] = await mailTo(d.science.email)
    expect(mail!.subject).toMatch(/feedback/i)
    expect(mail!.text).toContain(`/exercises/${d.id}/feedback`)
    expect(mail!.text).toContain('Ten minutes, please.')
    expect(mail!.text).toContain('EXERCISE — EXERCISE — EXERCISE')
  })

  it('is filled in by a player and shows up in the review by role and team', async () => {
    const form = await d.science.client.get(url('/feedback/mine'))
    expect(form.status).toBe(200)
    expect(form.json.response).toBeNull()
    expect(form.json.questions).toHaveLength(5)
    const bad = await d.science.client.post(url('/feedback'), { ratings: { ...answers.ratings, pace: 6, realism: undefined } })
    expect(issuePaths(bad)).toEqual(['ratings.pace', 'ratings.realism'])
    expect((await d.science.client.post(url('/feedback'), answers)).status).toBe(200)
    expect((await d.science.client.get(url('/feedback/mine'))).json.response).toMatchObject(answers)
    expect((await d.science.client.get(url('/feedback'))).status).toBe(403)

    const review = (await d.analyst.client.get(url('/feedback'))).json
    expect(review.summary.responses).toBe(1)
    expect(review.summary.invited).toBe(5)
    expect(review.summary.questions.find((q: { key: string }) => q.key === 'coordination')).toMatchObject({
      n: 1,
      mean: 2,
      counts: [0, 1, 0, 0, 0],
    })
    // One person's comment is held back (with a role and team it would name them), and who answered is not shown.
    expect(review.summary.comments).toEqual([])
    expect(review.summary.commentsWithheld).toBe(1)
    expect(JSON.stringify(review)).not.toContain(answers.wentWell)
    expect(JSON.stringify(review)).not.toContain('answered')
    expect(JSON.stringify(review.summary)).not.toContain('science member')
    expect(review.waiting).toBe(review.members.length - 1)
    // The reminder goes to those who have not answered, picked on the server: not the sender, not the one who answered.
    const remind = await d.analyst.client.post(url('/feedback/request'), { waiting: true })
    expect(remind.status).toBe(200)
    expect(remind.json.sent).toBe(review.members.length - 2)
    expect(review.members.find((m: { userId: string }) => m.userId === d.civil.id).askedAt).toBeTruthy()

    // Sent again, it replaces the earlier answers.
    await d.science.client.post(url('/feedback'), { ...answers, ratings: { ...answers.ratings, coordination: 4 } })
    const again = (await d.analyst.client.get(url('/feedback'))).json
    expect(again.summary.responses).toBe(1)
    expect(again.summary.questions.find((q: { key: string }) => q.key === 'coordination').mean).toBe(4)
  })
})
