// Protective-action zones: a team draws an evacuation, shelter or keep-out zone on its hazard map; every team, control,
// the evaluators and the wall see it live; its figures (the sites and people inside, and per threshold the chance
// that the damage reaches beyond it) are worked out on the server against the current solution and kept in the
// record; its team or control withdraws it; the timeline and exports carry both.
import { execFileSync } from 'node:child_process'
import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { baseUrl, Client } from '../support/client'
import { closeSockets, demoScenario, ikey, liveSocket, newLiveExercise, ready, until, type LiveCast } from '../support/live'
import type { Scenario } from '../../shared/scenario/schema'

let cast: LiveCast
let scenario: Scenario
const url = (p = '') => `/api/exercises/${cast.id}${p}`
const events = async (who: LiveCast['science']) =>
  ((await who.client.get(url('/events'))).json.events as Array<{ type: string; data: Record<string, unknown> }>)

beforeAll(async () => {
  cast = await newLiveExercise('Zones drill')
  scenario = await demoScenario(cast.facilitator)
}, 60_000)
afterAll(() => closeSockets())

const siteById = (id: string) => scenario.sites.find(s => s.id === id)!

describe('protective-action zones', () => {
  it('can be drawn before any solution (no figures yet), and once, whatever the retries', async () => {
    const key = ikey()
    const body = { kind: 'exclusion', name: 'Harbour approaches', shape: { type: 'circle', centre: [-9.4, 39.4], radiusKm: 8 }, idempotencyKey: key }
    const first = await cast.civil.client.post(url('/zones'), body)
    const again = await cast.civil.client.post(url('/zones'), body)
    expect([first.status, again.status]).toEqual([201, 200])
    expect(again.json.event.seq).toBe(first.json.event.seq)
    expect(first.json.event.data).toMatchObject({ teamKey: 'civil', kind: 'exclusion', figures: null, by: { name: expect.any(String) } })
  })

  it('reach control, the evaluators, every team and the wall live, with figures against the current solution', async () => {
    const last = scenario.solutions.at(-1)!
    expect((await cast.facilitator.client.post(url(`/solutions/${last.key}/publish`), {})).status).toBe(201)
    const made = await cast.facilitator.client.post(url('/wall-tokens'), { label: 'Zones wall' })
    const control = liveSocket(cast.facilitator.client.cookieHeader, { exerciseId: cast.id, lastSeq: 0 })
    const wall = liveSocket(null, { wallToken: made.json.token })
    await Promise.all([ready(control), ready(wall)])

    // Around the two towns nearest the nominal impact point, 12 km wide.
    const town = siteById('ponta-ferrada')
    const sent = await cast.civil.client.post(url('/zones'), {
      kind: 'evacuate', name: 'Ponta Ferrada seafront', note: 'Buses from the school at 06:00.',
      shape: { type: 'circle', centre: [town.lon, town.lat], radiusKm: 12 }, idempotencyKey: ikey(),
    })
    expect(sent.status).toBe(201)
    const figures = sent.json.event.data.figures
    expect(figures.solutionKey).toBe(last.key)
    expect(figures.siteIds).toContain('ponta-ferrada')
    const inside = scenario.sites.filter(s => figures.siteIds.includes(s.id))
    expect(figures.population).toBe(inside.reduce((n, s) => n + s.population, 0))
    // The reach of the damage comes with the assessment: every chance is a share of the sampled impacts.
    expect(Object.keys(figures.exposedOutside ?? {})).toEqual(expect.arrayContaining(['windows', 'houseCollapse', 'multistoreyCollapse']))
    for (const p of Object.values(figures.exposedOutside as Record<string, number>)) {
      expect(p).toBeGreaterThanOrEqual(0)
      expect(p).toBeLessThanOrEqual(1)
    }
    // People at sites outside the zone expected to meet each threshold: blast, heat and the tsunami's run-up.
    expect(Object.keys(figures.peopleOutside)).toEqual(expect.arrayContaining(['windows', 'burn2', 'runUp1m', 'runUp3m']))
    // A wider zone around the same centre leaves no more exposed.
    const wide = await cast.civil.client.post(url('/zones'), {
      kind: 'shelter', name: 'Coast strip', shape: { type: 'circle', centre: [town.lon, town.lat], radiusKm: 120 }, idempotencyKey: ikey(),
    })
    for (const [k, p] of Object.entries(wide.json.event.data.figures.exposedOutside as Record<string, number>)) {
      expect(p).toBeLessThanOrEqual((figures.exposedOutside as Record<string, number>)[k]!)
    }
    for (const [k, n] of Object.entries(wide.json.event.data.figures.peopleOutside as Record<string, number>)) {
      expect(n).toBeLessThanOrEqual((figures.peopleOutside as Record<string, number>)[k]!)
    }

    const heard = await until(() => control.events.find(e => e.type === 'zone.drawn' && e.data.name === 'Ponta Ferrada seafront'), 5000, 'zone at control')
    expect(heard.data.note).toBe('Buses from the school at 06:00.')
    const onWall = await until(() => wall.events.find(e => e.type === 'zone.drawn' && e.data.name === 'Ponta Ferrada seafront'), 5000, 'zone at the wall')
    // The wall shows the outline, kind and name; the note and who drew it stay with the desks.
    expect(onWall.data).toMatchObject({ kind: 'evacuate', note: '', by: { id: '', name: '' } })
    expect(onWall.data.shape).toEqual({ type: 'circle', centre: [town.lon, town.lat], radiusKm: 12 })
    for (const who of [cast.science, cast.comms, cast.evaluator, cast.analyst]) {
      expect((await events(who)).some(e => e.type === 'zone.drawn' && e.data.name === 'Ponta Ferrada seafront')).toBe(true)
    }
    // Desk and wall snapshots list them.
    expect((await cast.science.client.get(url('/live'))).json.zones.map((z: { name: string }) => z.name)).toContain('Ponta Ferrada seafront')
    const wallSnap = await new Client().get(`/api/wall/${made.json.token}`)
    expect(wallSnap.json.zones.map((z: { name: string }) => z.name)).toContain('Ponta Ferrada seafront')
  })

  it('control draws for the agencies it plays; a polygon works; bad shapes and other roles are refused', async () => {
    const ring = [[-9.5, 39.3], [-9.2, 39.3], [-9.2, 39.5], [-9.5, 39.5]]
    const byControl = await cast.facilitator.client.post(url('/zones'), { kind: 'exclusion', name: 'Maritime exclusion', shape: { type: 'polygon', ring }, idempotencyKey: ikey() })
    expect(byControl.status).toBe(201)
    expect(byControl.json.event.data.teamKey).toBe('control')
    expect(byControl.json.event.data.figures.siteIds).toContain('ponta-ferrada')

    const bowTie = await cast.civil.client.post(url('/zones'), {
      kind: 'evacuate', name: 'Twisted', shape: { type: 'polygon', ring: [[-9.5, 39.3], [-9.2, 39.5], [-9.2, 39.3], [-9.5, 39.5]] }, idempotencyKey: ikey(),
    })
    expect(bowTie.status).toBe(400)
    expect(bowTie.json.data.issues.map((i: { path: string }) => i.path)).toEqual(['shape.ring'])
    const huge = await cast.civil.client.post(url('/zones'), { kind: 'evacuate', name: 'Everything', shape: { type: 'circle', centre: [-9, 39], radiusKm: 5000 }, idempotencyKey: ikey() })
    expect(huge.status).toBe(400)
    const noName = await cast.civil.client.post(url('/zones'), { kind: 'evacuate', name: ' ', shape: { type: 'circle', centre: [-9, 39], radiusKm: 5 }, idempotencyKey: ikey() })
    expect(noName.json.data.issues.map((i: { path: string }) => i.path)).toEqual(['name'])
    expect((await cast.evaluator.client.post(url('/zones'), { kind: 'evacuate', name: 'X', shape: { type: 'circle', centre: [-9, 39], radiusKm: 5 }, idempotencyKey: ikey() })).status).toBe(403)
  })

  it('are withdrawn by their team or control only, once, and stay in the record marked', async () => {
    const zone = (await cast.civil.client.post(url('/zones'), {
      kind: 'shelter', name: 'Schools shelter', shape: { type: 'circle', centre: [-9.1, 39.5], radiusKm: 6 }, idempotencyKey: ikey(),
    })).json.event.data
    expect((await cast.science.client.delete(url(`/zones/${zone.id}`))).status).toBe(403)
    expect((await cast.evaluator.client.delete(url(`/zones/${zone.id}`))).status).toBe(403)
    expect((await cast.civil.client.delete(url(`/zones/${zone.id}`))).status).toBe(200)
    const again = await cast.facilitator.client.delete(url(`/zones/${zone.id}`))
    expect(again.status).toBe(409)
    expect((await cast.civil.client.delete(url('/zones/00000000-0000-4000-8000-000000000000'))).status).toBe(404)
    const listed = (await cast.comms.client.get(url('/live'))).json.zones as Array<{ id: string; withdrawn: { by: string } | null }>
    expect(listed.find(z => z.id === zone.id)!.withdrawn).toMatchObject({ by: expect.any(String) })

    // Control may withdraw a team's zone.
    const other = (await cast.civil.client.post(url('/zones'), {
      kind: 'evacuate', name: 'Camp site', shape: { type: 'circle', centre: [-9.0, 39.7], radiusKm: 3 }, idempotencyKey: ikey(),
    })).json.event.data
    expect((await cast.facilitator.client.delete(url(`/zones/${other.id}`))).status).toBe(200)
  })

  it('appear in the timeline and its exports, with their figures', async () => {
    const csv = (await cast.facilitator.client.get(url('/timeline.csv'))).text
    expect(csv).toContain('Zone drawn by Coastal Protection Directorate')
    expect(csv).toContain('Evacuate — Ponta Ferrada seafront')
    expect(csv).toMatch(/chance the damage reaches beyond the zone/)
    expect(csv).toContain('Zone withdrawn: Schools shelter')
  })

  it('are listed in the after-action report (data, page and PDF) with their figures when drawn and at the end', async () => {
    const report = (await cast.facilitator.client.get(url('/report'))).json
    const seafront = report.zones.find((z: { name: string }) => z.name === 'Ponta Ferrada seafront')
    expect(seafront).toMatchObject({ kind: 'Evacuate', team: 'Coastal Protection Directorate', withdrawnAt: null, note: 'Buses from the school at 06:00.' })
    expect(seafront.whenDrawn).toMatch(/^\d+ sites? inside \([\d,]+ people\)\. If it strikes/)
    const first = report.zones.find((z: { name: string }) => z.name === 'Harbour approaches')
    expect(first.whenDrawn).toMatch(/before any orbit solution/)
    expect(first.atEnd).toMatch(/inside|No site/)
    expect(report.zones.find((z: { name: string }) => z.name === 'Schools shelter').withdrawnAt).not.toBeNull()

    const pdf = await fetch(`${baseUrl()}${url('/report.pdf')}`, { headers: { cookie: cast.facilitator.client.cookieHeader ?? '' } })
    expect(pdf.status).toBe(200)
    const dir = mkdtempSync(join(tmpdir(), 'bw-zones-'))
    writeFileSync(join(dir, 'r.pdf'), Buffer.from(await pdf.arrayBuffer()))
    const text = execFileSync('/usr/bin/pdftotext', ['-enc', 'UTF-8', join(dir, 'r.pdf'), '-'], { encoding: 'utf8' }).replace(/\u200b/g, '')
    expect(text).toContain('Protective-action zones')
    expect(text).toContain('Ponta Ferrada seafront')
    expect(text).toContain('Maritime exclusion')
  }, 60_000)

  it('are closed once the drill has ended', async () => {
    expect((await cast.facilitator.client.post(url('/clock'), { action: 'start' })).status).toBeLessThan(300)
    expect((await cast.facilitator.client.post(url('/clock'), { action: 'end' })).status).toBeLessThan(300)
    const late = await cast.civil.client.post(url('/zones'), { kind: 'evacuate', name: 'Late', shape: { type: 'circle', centre: [-9, 39], radiusKm: 5 }, idempotencyKey: ikey() })
    expect(late.status).toBe(409)
  })
})
