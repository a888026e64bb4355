import { z } from 'zod'
import { PartialMatchSchema, VerdictSchema } from './analysis'

/*
 * The frozen content of a certificate, the one source of its types
 * (shared/certificates/content.ts). The hash covers the content exactly as stored;
 * these schemas only read it for display, so a certificate signed before a field
 * existed (the uncertainty paragraph) still renders and verifies.
 */

/** One tuned partial of one piece as frozen on a certificate: the fields of its match that decide and show the verdict. */
export const CertificatePartialSchema = PartialMatchSchema.pick({
  label: true, targetHz: true, measuredHz: true, cents: true, toleranceCents: true, required: true, within: true, missing: true,
})

export const CertificatePieceSchema = z.object({
  position: z.number(),
  note: z.string(),
  targetHz: z.number(),
  template: z.string(),
  lot: z.string().nullable(),
  temperatureC: z.number().nullable(),
  humidityPct: z.number().nullable(),
  partials: z.array(CertificatePartialSchema),
  verdict: VerdictSchema,
  /** The supervisor's reason when a piece was approved although its strike was not within. */
  overrideReason: z.string().nullable(),
})

export const RangeSchema = z.object({ min: z.number(), max: z.number() })

export const CertificateContentSchema = z.object({
  format: z.literal('tonewright-certificate/1'),
  number: z.string(),
  verificationUrl: z.string(),
  supersedes: z.string().nullable(),
  workshop: z.object({ name: z.string(), address: z.string() }),
  buyer: z.object({ name: z.string(), organisation: z.string(), email: z.string() }),
  instrument: z.object({
    name: z.string(),
    model: z.string(),
    serial: z.string(),
    range: z.string(),
    pieceCount: z.number(),
    scrappedCount: z.number(),
    // The permit number was added for listed timber species: older certificates read it as none.
    lots: z.array(z.object({ code: z.string(), material: z.string(), species: z.string(), permitNumber: z.string().default('') })),
  }),
  referenceHz: z.number(),
  temperament: z.string(),
  conditions: z.object({
    temperatureC: RangeSchema.nullable(),
    humidityPct: RangeSchema.nullable(),
    strikeCount: z.number(),
    normalisation: z.array(z.object({ template: z.string(), referenceTemperatureC: z.number(), coefficientCentsPerC: z.number() })),
    statement: z.string(),
  }),
  method: z.string(),
  decisionRule: z.string(),
  /** Added with the per-partial uncertainty: older certificates read a sentence that says it was not stated. */
  uncertainty: z.string().default('No measurement uncertainty was stated on this certificate.'),
  engineVersions: z.array(z.string()),
  pieces: z.array(CertificatePieceSchema),
  signer: z.object({ name: z.string(), role: z.string() }),
  signedAt: z.string(),
  scope: z.string(),
})

/** Content as a row stores it (any earlier shape of format 1). */
export type StoredCertificateContent = z.input<typeof CertificateContentSchema>

/** Stored content in the current shape, for display; hashing always uses the stored JSON as it is. */
export function parseCertificateContent(stored: unknown) {
  const parsed = CertificateContentSchema.safeParse(stored)
  if (!parsed.success) throw new Error(`A stored certificate cannot be read: ${parsed.error.issues[0]?.path.join('.')} ${parsed.error.issues[0]?.message}`)
  return parsed.data
}
