import { z } from 'zod'
import { ROLES } from '../auth/roles'
import { wordsOr } from '../format/words'

export const EmailSchema = z.string({ required_error: 'Enter an e-mail address' })
  .trim().toLowerCase().email('Enter a valid e-mail address').max(254, 'That e-mail address is too long')

export const PasswordSchema = z.string({ required_error: 'Enter a password' })
  .min(10, 'Use at least 10 characters for a password').max(200, 'That password is too long')

export const SignInSchema = z.object({
  email: EmailSchema,
  password: z.string({ required_error: 'Enter your password' }).min(1, 'Enter your password').max(200, 'That password is too long'),
})
export type SignInInput = z.infer<typeof SignInSchema>

export const SignUpSchema = z.object({
  name: z.string({ required_error: 'Enter your name' }).trim().min(1, 'Enter your name').max(120, 'That name is too long'),
  email: EmailSchema,
  password: PasswordSchema,
  workshopName: z.string({ required_error: 'Name your workshop' }).trim().min(2, 'Name your workshop').max(120, 'That workshop name is too long'),
})
export type SignUpInput = z.infer<typeof SignUpSchema>

export const RoleSchema = z.enum(ROLES, { errorMap: () => ({ message: `Choose a role: ${wordsOr(ROLES)}` }) })

export const AddMemberSchema = z.object({
  name: z.string({ required_error: 'Enter the member\'s name' }).trim().min(1, 'Enter the member\'s name').max(120, 'That name is too long'),
  email: EmailSchema,
  role: RoleSchema,
  temporaryPassword: PasswordSchema,
})
export type AddMemberInput = z.infer<typeof AddMemberSchema>

export const ChangeRoleSchema = z.object({ role: RoleSchema })

export const SwitchWorkshopSchema = z.object({ workshopId: z.string().uuid('Choose a workshop') })

export const CreateWorkshopSchema = z.object({
  name: z.string({ required_error: 'Name the workshop' }).trim().min(2, 'Name the workshop').max(120, 'That workshop name is too long'),
})

export const ChangePasswordSchema = z.object({
  currentPassword: z.string({ required_error: 'Enter your current password' }).min(1, 'Enter your current password').max(200, 'That password is too long'),
  newPassword: PasswordSchema,
}).refine(v => v.currentPassword !== v.newPassword, { message: 'Choose a new password different from the current one', path: ['newPassword'] })
