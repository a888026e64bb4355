import { z } from 'zod'
import { EmailSchema, PasswordSchema, RoleSchema } from './auth'
import { PAPER_SIZES } from '../records/lists'
import { wordsOr } from '../format/words'

export const SendCertificateSchema = z.object({ to: EmailSchema.optional() }).default({})
export const RevokeCertificateSchema = z.object({
  reason: z.string({ required_error: 'Give the reason for revoking' }).trim().min(5, 'Give a reason of at least 5 characters').max(500, 'A reason is at most 500 characters'),
})
export const ReissueCertificateSchema = z.object({
  reason: z.string({ required_error: 'Give the reason for re-issuing' }).trim().min(5, 'Give a reason of at least 5 characters').max(500, 'A reason is at most 500 characters'),
})
export const PdfQuerySchema = z.object({
  paper: z.enum(PAPER_SIZES, { errorMap: () => ({ message: `Choose the paper: ${wordsOr(PAPER_SIZES)}` }) }).default('a4'),
  download: z.enum(['0', '1']).optional(),
})
export const CertificateListQuerySchema = z.object({
  set: z.string().uuid('Choose a set').optional(),
  /** Part of a buyer's name, organisation or e-mail, a serial or a certificate number. */
  q: z.string().trim().max(80, 'Search for at most 80 characters').optional().transform(q => q || undefined),
})
/** 96-bit codes are 16 base64url characters; anything else cannot be a code. */
export const VerifyParams = z.object({ code: z.string().regex(/^[\w-]{8,64}$/, 'That is not a verification code') })

export const InviteSchema = z.object({
  name: z.string().trim().max(120, 'That name is too long').default(''),
  email: EmailSchema,
  role: RoleSchema,
})
export const TokenSchema = z.string({ required_error: 'The link is incomplete' }).regex(/^[\w-]{20,100}$/, 'The link is incomplete or damaged')
export const InvitationLookupSchema = z.object({ token: TokenSchema })
// Name and password are for a new account; an existing one accepts while signed in and sends neither.
export const AcceptInvitationSchema = z.object({
  token: TokenSchema,
  name: z.string().trim().min(1, 'Enter your name').max(120, 'That name is too long').optional(),
  password: PasswordSchema.optional(),
})
export const PasswordResetRequestSchema = z.object({ email: EmailSchema })
export const PasswordResetSchema = z.object({ token: TokenSchema, password: PasswordSchema })
export const MailboxParams = z.object({ id: z.string().regex(/^[\w-]{10,80}$/, 'No such message'), file: z.string().regex(/^[\w.-]{1,200}$/, 'No such attachment') })
