// The password policy (shared/utils/password.ts): 10 to 200 characters, not a well-known password;
// e-mail addresses trimmed and lower-cased before they are compared.
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { emailSchema, passwordSchema } from '../../../shared/utils/password'

const COMMON = ['password', 'password1', 'password123', '1234567890', 'qwertyuiop', 'letmein123', 'iloveyou12', 'brinkwater', 'changeme123']

describe('the password policy', () => {
  it('accepts any password of 10 to 200 characters that is not a common one', () => {
    fc.assert(fc.property(fc.string({
      minLength: 10,
      maxLength: 200,
      unit: 'grapheme-ascii',
    }).filter(p => !COMMON.includes(p.toLowerCase())), (p) => {
      expect(passwordSchema.safeParse(p).success).toBe(true)
    }), { numRuns: 500 })
  })

  it('refuses anything shorter than 10 or longer than 200 characters', () => {
    fc.assert(fc.property(fc.oneof(
      fc.string({ maxLength: 9, unit: 'grapheme-ascii' }),
      fc.string({ minLength: 201, maxLength: 400, unit: 'grapheme-ascii' }),
    ), (p) => {
      expect(passwordSchema.safeParse(p).success).toBe(false)
    }), { numRuns: 300 })
  })

  it('refuses the common passwords whatever their case', () => {
    fc.assert(fc.property(fc.constantFrom(...COMMON), fc.array(fc.boolean(), { minLength: 12, maxLength: 12 }), (p, upper) => {
      const cased = [...p].map((c, i) => (upper[i] ? c.toUpperCase() : c)).join('')
      expect(passwordSchema.safeParse(cased).success).toBe(false)
    }))
  })

  it('compares e-mail addresses trimmed and lower-cased, and refuses what is not an address', () => {
    expect(emailSchema.parse('  Admin@Brinkwater.TEST ')).toBe('admin@brinkwater.test')
    for (const bad of [
      '',
      'admin',
      'a@',
      '@b.test',
      'a b@c.test',
      `${'a'.repeat(250)}@b.test`,
    ]) expect(emailSchema.safeParse(bad).success, bad).toBe(false)
  })
})
