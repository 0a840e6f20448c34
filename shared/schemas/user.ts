import { z } from 'zod'
import { roleSchema } from './roles'

export const passwordSchema = z.string({ error: 'A password is needed' }).min(12, 'At least 12 characters').max(200, 'At most 200 characters')
const email = z.string({ error: 'An e-mail address is needed' }).trim().toLowerCase().pipe(z.email('Not an e-mail address')).refine(e => e.length <= 200, 'Too long')

export const loginSchema = z.object({
  email: z.string({ error: 'An e-mail address is needed' }).trim().toLowerCase().min(1, 'An e-mail address is needed').max(200),
  password: z.string({ error: 'A password is needed' }).min(1, 'A password is needed').max(200)
})

export const userCreateSchema = z.object({
  email,
  name: z.string({ error: 'A name is needed' }).trim().min(1, 'A name is needed').max(80),
  roles: z.array(roleSchema).min(1, 'At least one role').max(6),
  password: passwordSchema
}).strict()

export const userUpdateSchema = z.object({
  name: z.string().trim().min(1, 'A name is needed').max(80).optional(),
  roles: z.array(roleSchema).min(1, 'At least one role').max(6).optional(),
  active: z.boolean().optional(),
  password: passwordSchema.optional()
}).strict()

export type UserCreate = z.output<typeof userCreateSchema>
export type UserUpdate = z.output<typeof userUpdateSchema>
