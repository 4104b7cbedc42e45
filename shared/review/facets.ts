/** What the review desk filters the timeline by: the teams an event concerns and the phase it falls in. */
import type { StoredEvent } from '../live/types'
import { phaseAt } from '../live/schedule'
import type { Scenario } from '../scenario/schema'

export interface TimelineFacets { seq: number; teamKeys: string[]; phaseKey: string | null }

/** Teams of an event (empty: it concerns everyone or no team in particular) and its phase (the inject's, else the phase at its scenario
 * time). */
export function eventFacets(e: StoredEvent, scenario: Pick<Scenario, 'injects' | 'phases'>): TimelineFacets {
  let teamKeys: string[] = []
  let phaseKey: string | null = null
  switch (e.type) {
    case 'inject.released':
    case 'message.sent': {
      const d = e.data
      teamKeys = d.teams
      phaseKey = d.phase
      break
    }
    case 'inject.revised': teamKeys = e.data.teams; break
    case 'inject.held': teamKeys = e.data.teams; break
    case 'response.submitted': teamKeys = [e.data.teamKey]; break
    case 'observation.recorded': {
      const k = e.data.teamKey
      teamKeys = k ? [k] : []
      break
    }
  }
  return { seq: e.seq, teamKeys, phaseKey: phaseKey ?? phaseAt(scenario, e.scenarioTime) }
}
