import { z } from 'zod'
import { emailSchema, passwordSchema } from '../utils/password'

export const loginSchema = z.object({
  email: emailSchema,
  password: z.string().min(1, 'Enter your password.').max(200),
})

export const forgotSchema = z.object({ email: emailSchema })

export const setPasswordSchema = z.object({
  token: z.string().min(20).max(200),
  password: passwordSchema,
})

export const inviteSchema = z.object({
  email: emailSchema,
  name: z.string().trim().min(1, 'Enter a name.').max(120),
  systemRole: z.enum(['admin', 'member']).default('member'),
})

export const idParamSchema = z.object({ id: z.string().uuid('Not a valid id.') })
