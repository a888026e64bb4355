import { z } from 'zod'
import { finite } from './records'

/** A form field holding a number: empty is missing, anything else must read as a number. */
const numberField = <S extends z.ZodTypeAny>(schema: S) => z.preprocess(
  v => (typeof v === 'string' ? (v.trim() === '' ? undefined : Number(v.trim())) : v),
  schema,
)

/** The form fields of `POST /api/calibrations` (the recording itself is the `file` part). */
export const CalibrationFieldsSchema = z.object({
  referenceHz: numberField(finite('the reference frequency').min(20, 'The reference frequency must be between 20 and 20 000 Hz').max(20000, 'The reference frequency must be between 20 and 20 000 Hz')),
  device: z.string({ required_error: 'Name the input device' }).trim().min(1, 'Name the input device').max(120, 'A device name is at most 120 characters'),
  reference: z.string({ invalid_type_error: 'Describe the reference in words' }).trim().max(300, 'A reference description is at most 300 characters').default(''),
  referenceUncertaintyPpm: numberField(finite('the reference uncertainty').min(0, 'The reference uncertainty must be between 0 and 1000 ppm').max(1000, 'The reference uncertainty must be between 0 and 1000 ppm').optional()),
})
export type CalibrationFields = z.infer<typeof CalibrationFieldsSchema>

/** What the route answers. */
export interface CalibrationAnswer {
  id: string
  offsetPpm: number
  uncertaintyPpm: number
}

/** The multipart field that picks the input calibration a strike is measured under (kept exactly: `calibration-id`). */
export const CalibrationChoiceSchema = z.object({
  'calibration-id': z.preprocess(
    v => (typeof v === 'string' && v.trim() === '' ? undefined : typeof v === 'string' ? v.trim() : v),
    z.string().uuid('That is not a valid calibration id.').optional(),
  ),
})

/** A calibration as strikes and screens show it. */
export interface CalibrationView {
  id: string
  device: string
  referenceHz: number
  referenceUncertaintyPpm: number
  /** What the reference tone came from, in the workshop's words ('' when not given). */
  referenceDescription: string
  measuredHz: number
  offsetPpm: number
  uncertaintyPpm: number
  /** ISO time the reference tone was measured. */
  measuredAt: string
  operatorName: string | null
  /** ISO time it stops being valid under the workshop's interval. */
  expiresAt: string
  expired: boolean
  /** Whole days until expiry; negative: days since (calibrationExpiry). */
  daysLeft: number
}

/** What a strike or an analysis answer says about the calibration applied. */
export type AppliedCalibration = Pick<CalibrationView, 'id' | 'offsetPpm' | 'uncertaintyPpm' | 'device' | 'measuredAt' | 'expiresAt'>

/** `GET /api/calibrations`: each device's calibrations, newest first (the first is its current one). */
export interface CalibrationList {
  validDays: number
  devices: { device: string, current: CalibrationView, history: CalibrationView[] }[]
}
