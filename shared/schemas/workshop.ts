import { z } from 'zod'
import { isLocale, isTimeZone } from '../format/dates'
import { TEMPERATURE_UNITS } from '../records/lists'
import { finite } from './records'

/** The default reference pitch a workshop may choose: A4 a semitone below 440 Hz (415) to a semitone above (466). */
export const WORKSHOP_REFERENCE_HZ = { min: 415, max: 466 } as const
const PITCH_RANGE = `The default reference pitch must be between ${WORKSHOP_REFERENCE_HZ.min} and ${WORKSHOP_REFERENCE_HZ.max} Hz`

/** A workshop's settings as the owner sets them and every member reads them. */
/** How long an input calibration stays valid, days: a day to ten years. */
export const CALIBRATION_VALID_DAYS = { min: 1, max: 3650 } as const
const CALIBRATION_RANGE = `The calibration interval must be between ${CALIBRATION_VALID_DAYS.min} and ${CALIBRATION_VALID_DAYS.max} days`

export const WorkshopSettingsSchema = z.object({
  timeZone: z.string({ invalid_type_error: 'Choose a time zone' }).trim()
    .refine(isTimeZone, 'That is not a time zone name; choose one such as Europe/Berlin or America/Chicago'),
  locale: z.string({ invalid_type_error: 'Choose a language for dates' }).trim()
    .refine(isLocale, 'That is not a language tag for dates; write one such as en-GB or de-DE'),
  temperatureUnit: z.enum(TEMPERATURE_UNITS, { errorMap: () => ({ message: 'The temperature unit is °C or °F (C or F)' }) }),
  referenceHz: finite('the default reference pitch').min(WORKSHOP_REFERENCE_HZ.min, PITCH_RANGE).max(WORKSHOP_REFERENCE_HZ.max, PITCH_RANGE),
  calibrationValidDays: z.number({ invalid_type_error: 'The calibration interval must be a number of days' }).int('The calibration interval is a whole number of days')
    .min(CALIBRATION_VALID_DAYS.min, CALIBRATION_RANGE).max(CALIBRATION_VALID_DAYS.max, CALIBRATION_RANGE),
  /** Ask for three strikes of a piece in its final form before it may go to review (the budget's repeatability). */
  repeatStrikesBeforeReview: z.boolean({ invalid_type_error: 'Asking for three strikes before review is on or off (true or false)' }),
})
export type WorkshopSettings = z.infer<typeof WorkshopSettingsSchema>

/** A change to some of the settings; an unknown field or an empty change is refused. */
export const WorkshopSettingsPatchSchema = WorkshopSettingsSchema.partial().strict()
  .refine(patch => Object.keys(patch).length > 0, 'There is nothing to change; send at least one setting')
