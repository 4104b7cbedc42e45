/** Shapes the review API sends for the tables of the review desk (findings, improvement plan, hotwash). */
import type { FindingKind, HotwashSection, ItemStatus, PoeteElement } from './plan'

export interface Finding {
  id: string
  kind: FindingKind
  objectiveKey: string
  capability: string
  title: string
  detail: string
  createdAt: string
  updatedAt: string
}

export interface ImprovementItem {
  id: string
  findingId: string | null
  objectiveKey: string
  capability: string
  action: string
  element: PoeteElement
  owner: string
  startDate: string
  dueDate: string
  status: ItemStatus
  createdAt: string
  updatedAt: string
}

export interface HotwashNote {
  key: HotwashSection
  title: string
  hint: string
  body: string
  revision: number
  updatedAt: string | null
  updatedBy: string | null
}
