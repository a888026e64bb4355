import { z } from 'zod'
import { PartialMatchSchema, VerdictSchema } from './analysis'
import { DECISION_RULES, DECISION_VERDICTS, DISTRIBUTIONS } from '../uncertainty/types'

/*
 * The frozen content of a certificate, the one source of its types
 * (shared/certificates/content.ts). The hash covers the content exactly as stored;
 * these schemas only read it for display, so a certificate signed before a field
 * existed (the uncertainty paragraph) still renders and verifies.
 */

/** One tuned partial of one piece as frozen on a certificate: the fields of its match that decide and show the verdict. */
export const CertificatePartialSchema = PartialMatchSchema.pick({
  label: true, targetHz: true, measuredHz: true, cents: true, toleranceCents: true, required: true, within: true, missing: true,
}).extend({
  /** Expanded uncertainty U (k = 2) of the deviation from the piece's budget; certificates signed before budgets read none. */
  expandedUncertaintyCents: z.number().nullable().default(null),
})

/** One line of a frozen budget (JCGM 100:2008 §5.1). */
export const CertificateBudgetLineSchema = z.object({
  name: z.string(), value: z.number(), unit: z.string(), distribution: z.enum(DISTRIBUTIONS),
  divisor: z.number(), sensitivity: z.number(), standardUncertainty: z.number(), contribution: z.number(),
})

/** A partial's frozen budget: its lines, u, U and what could not be assessed. */
export const CertificateBudgetSchema = z.object({
  label: z.string(),
  lines: z.array(CertificateBudgetLineSchema),
  combinedStandardUncertaintyCents: z.number(),
  expandedUncertaintyCents: z.number(),
  coverageFactor: z.number(),
  notAssessed: z.array(z.object({ name: z.string(), reason: z.string() })),
})

/** The piece's verdict under its template's decision rule, and whether the other rule would give another. */
export const CertificateDecisionSchema = z.object({
  rule: z.enum(DECISION_RULES),
  verdict: z.enum(DECISION_VERDICTS).nullable(),
  otherVerdict: z.enum(DECISION_VERDICTS).nullable(),
  dependsOnRule: z.boolean(),
})

/** An input calibration the certificate's strikes were measured under. */
export const CertificateCalibrationSchema = z.object({
  device: z.string(), calibratedAt: z.string(), offsetPpm: z.number(), uncertaintyPpm: z.number(),
  expired: z.boolean(), driftAssessed: z.boolean(), pieceCount: z.number(),
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
  // Added with the uncertainty budget: older certificates read none.
  decision: CertificateDecisionSchema.nullable().default(null),
  budget: z.array(CertificateBudgetSchema).default([]),
  clock: z.string().nullable().default(null),
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
  /** The input calibrations the strikes were measured under, and how many pieces had none (added with the budget). */
  calibrations: z.array(CertificateCalibrationSchema).default([]),
  uncalibratedPieceCount: z.number().nullable().default(null),
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
