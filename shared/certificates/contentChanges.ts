import { z } from 'zod'
import { CertificateContentSchema } from '../schemas/certificateContent'
import type { FieldChange } from '../schemas/setEdit'

/** The parts of a certificate's frozen content that an edit of its set can change. */
export interface CertificateHeading {
  buyer: { name: string, organisation: string, email: string }
  instrument: { name: string, model: string, serial: string }
}

const HeadingSchema = z.object({
  buyer: CertificateContentSchema.shape.buyer,
  instrument: CertificateContentSchema.shape.instrument.pick({ name: true, model: true, serial: true }),
})

/** The heading of stored content, or null when it cannot be read (a damaged row still gets its re-issue). */
export function readHeading(stored: unknown): CertificateHeading | null {
  const parsed = HeadingSchema.safeParse(stored)
  return parsed.success ? parsed.data : null
}

const FIELDS: { field: string, read: (c: CertificateHeading) => string }[] = [
  { field: 'buyer', read: c => c.buyer.name },
  { field: 'buyer organisation', read: c => c.buyer.organisation },
  { field: 'buyer e-mail', read: c => c.buyer.email },
  { field: 'instrument', read: c => c.instrument.name },
  { field: 'model', read: c => c.instrument.model },
  { field: 'serial', read: c => c.instrument.serial },
]

/** What a re-issue says differently from the certificate it supersedes, field by field. */
export function certificateChanges(previous: CertificateHeading, next: CertificateHeading): FieldChange[] {
  return FIELDS.filter(f => f.read(previous) !== f.read(next)).map(f => ({ field: f.field, from: f.read(previous), to: f.read(next) }))
}
