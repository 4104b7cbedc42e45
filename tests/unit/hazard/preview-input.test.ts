import { describe, it, expect } from 'vitest'
import { previewSchema } from '../../../shared/schemas/scenarios'
import { demoSolution } from './fixtures'

describe('the editor preview accepts every seed the engine uses', () => {
  it('takes any safe integer (1 and 2^32 + 1 are different seeds) and refuses the rest', () => {
    const solution = demoSolution()
    expect(previewSchema.parse({ solution, seed: 2 ** 32 + 1 }).seed).toBe(2 ** 32 + 1)
    expect(previewSchema.parse({ solution, seed: -5 }).seed).toBe(-5)
    expect(previewSchema.parse({ solution }).seed).toBe(1)
    expect(previewSchema.safeParse({ solution, seed: 2 ** 53 }).success).toBe(false)
    expect(previewSchema.safeParse({ solution, seed: 1.5 }).success).toBe(false)
  })
})

describe('the corridor of an orbit solution', () => {
  it('takes at most 2 000 points (a 250 000-point path stalled the server)', () => {
    const solution = demoSolution()
    const line = (n: number) => Array.from({ length: n }, (_, k) => [-20 + k * 1e-4, 37] as [number, number])
    expect(previewSchema.safeParse({ solution: { ...solution, corridor: { ...solution.corridor, path: line(2000) } } }).success).toBe(true)
    const r = previewSchema.safeParse({ solution: { ...solution, corridor: { ...solution.corridor, path: line(2001) } } })
    expect(r.success).toBe(false)
  })
})
