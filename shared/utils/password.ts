import { z } from 'zod'

const COMMON = new Set([
  'password',
  'password1',
  'password123',
  '1234567890',
  'qwertyuiop',
  'letmein123',
  'iloveyou12',
  'brinkwater',
  'changeme123',
])

/** Password policy: at least 10 characters, at most 200, not a well-known password. */
export const passwordSchema = z.string()
  .min(10, 'Use at least 10 characters.')
  .max(200, 'Use at most 200 characters.')
  .refine(p => !COMMON.has(p.toLowerCase()), 'This password is too common.')

export const emailSchema = z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.')).pipe(z.string().max(254))
