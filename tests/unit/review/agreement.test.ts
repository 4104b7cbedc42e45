import { describe, expect, it } from 'vitest'
import { cohenKappa, kappaFromTable, landisKoch } from '../../../shared/review/agreement'
import { guardCsvCell } from '../../../shared/review/csv'

describe('Cohen\'s kappa', () => {
  it('reproduces the worked example of Cohen (1960)', () => {
    // J. Cohen (1960), Educational and Psychological Measurement 20(1): 37–46, Table 1: 200 items,
    // three categories, p_o = .70, p_c = .41, κ = .49. The cell counts are from memory; the
    // published p_o, p_c and κ fix the diagonal (88, 40, 12) and the marginals (120/60/20, 100/60/40).
    const r = kappaFromTable([
      [88, 14, 18],
      [10, 40, 10],
      [2, 6, 12],
    ])
    expect(r.n).toBe(200)
    expect(r.observed).toBeCloseTo(0.70, 10)
    expect(r.expected).toBeCloseTo(0.41, 10)
    expect(r.kappa).toBeCloseTo(0.4915, 4)
    expect(r.strength).toBe('moderate')
  })

  it('is 1 for perfect agreement, 0 at chance, negative below it', () => {
    expect(cohenKappa([['P', 'P'], ['S', 'S'], ['M', 'M'], ['U', 'U']], ['P', 'S', 'M', 'U']).kappa).toBe(1)
    // Each rater says P half the time, independently: observed = expected = 0.5.
    expect(kappaFromTable([[25, 25], [25, 25]]).kappa).toBe(0)
    expect(kappaFromTable([[0, 10], [10, 0]]).kappa).toBe(-1)
  })

  it('is undefined with no items or when both raters always give the same single rating', () => {
    expect(kappaFromTable([[0, 0], [0, 0]]).kappa).toBeNull()
    expect(cohenKappa([['S', 'S'], ['S', 'S']], ['P', 'S', 'M', 'U']).kappa).toBeNull()
  })

  it('names strength after Landis & Koch (1977)', () => {
    expect([-0.1, 0.1, 0.3, 0.5, 0.7, 0.9].map(landisKoch)).toEqual(['poor', 'slight', 'fair', 'moderate', 'substantial', 'almost perfect'])
  })
})

describe('CSV cells', () => {
  it.each([
    ['=HYPERLINK("http://x")', '\'=HYPERLINK("http://x")'],
    ['+1+1', '\'+1+1'],
    ['-2', '\'-2'],
    ['@SUM(A1)', '\'@SUM(A1)'],
    ['\t=1', '\'\t=1'],
    ['plain text', 'plain text'],
    ['', ''],
  ])('guards %j', (input, expected) => {
    expect(guardCsvCell(input)).toBe(expected)
  })
})
