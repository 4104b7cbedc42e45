import { describe, expect, it } from 'vitest'
import { fnv1a32, PUBLISH_SAMPLES, solutionSeed } from '../../../shared/live/seed'

describe('the seed of a solution', () => {
  // Check values of 32-bit FNV-1a from the reference test suite of Fowler, Noll and Vo (recalled from memory):
  // "" → the offset basis, "a" → 0xe40c292c, "foobar" → 0xbf9cf968.
  it.each([['', 0x811C9DC5], ['a', 0xE40C292C], ['foobar', 0xBF9CF968]])('hashes %j as FNV-1a does', (text, hash) => {
    expect(fnv1a32(text)).toBe(hash)
  })

  it('is the same for a solution wherever it is computed, differs between solutions, and fits 31 bits', () => {
    expect(solutionSeed('demo-ocean-impact', 's1-discovery')).toBe(fnv1a32('demo-ocean-impact:s1-discovery') >>> 1)
    expect(solutionSeed('demo-ocean-impact', 's1-discovery')).not.toBe(solutionSeed('demo-ocean-impact', 's2-refined'))
    expect(solutionSeed('a', 'b')).toBeLessThan(2 ** 31)
    expect(PUBLISH_SAMPLES).toBe(20_000)
  })
})
