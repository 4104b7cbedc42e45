// A small run of the load bench (scripts/bench/load.ts, 500 members in `npm run bench`): 60 members
// signed in with their own accounts across the three team rooms, control and evaluators, a 50-inject
// drill on a compressed clock, and every player answering every request for decision of their team
// (some twice with the same key). Nothing is lost or delivered twice, no response is recorded twice,
// and the live heap after a full GC stays bounded. Speeds are the bench's business, not asserted here.
import { describe, expect, it } from 'vitest'
import { formatLoadReport, runLoad } from '../support/load'

describe('a drill under load', () => {
  it('delivers every event once to each of 60 members and records each answer once', async () => {
    const report = await runLoad({ sockets: 60, extraInjects: 16, wallSeconds: 15, retryShare: 0.1 })
    console.info(`[drill-under-load]\n${formatLoadReport(report)}`)
    expect(report.injects.scheduled).toBe(50)
    expect(report.errors).toEqual([])
    expect(report.lost).toBe(0)
    expect(report.duplicateDeliveries).toBe(0)
    expect(report.duplicateResponses).toBe(0)
    expect(report.responses.errors).toBe(0)
    expect(report.responses.retried).toBeGreaterThan(0)
    expect(report.deliveryAll.samples).toBeGreaterThan(50 * 19)
    expect(report.memory.heapEndMiB - report.memory.heapStartMiB).toBeLessThan(40)
  }, 180_000)
})
