import { AnalysisError } from './AnalysisError'
import { AnalyzeOptionsSchema } from './analyzeOptionsSchema'
import type { AnalyzeOptions } from './types'

/** Form field / command-line name of each option, for messages. */
const NUMBER_FIELDS = [
  'targetHz',
  'referenceHz',
  'searchWindowCents',
  'referenceTemperatureC',
  'temperatureCoefficientCentsPerC',
  'temperatureC',
  'attackSkipS',
  'windowS',
  'clockOffsetPpm',
] as const

const FIELD_NAMES: Record<string, string> = {
  targetHz: 'The target frequency',
  referenceHz: 'The reference pitch',
  searchWindowCents: 'The search window',
  referenceTemperatureC: 'The reference temperature',
  temperatureCoefficientCentsPerC: 'The temperature coefficient',
  temperatureC: 'The bench temperature',
  attackSkipS: 'The attack skip',
  windowS: 'The window length',
  clockOffsetPpm: 'The clock offset',
  ratios: 'Every ratio',
  tolerances: 'Every tolerance',
}

/**
 * Turn string fields (a multipart form or command-line flags) into validated
 * AnalyzeOptions. Empty fields count as absent; lists are comma-separated
 * (`ratios` "1,4,10", `tolerances` "2,5,8", `labels` "fundamental,octave",
 * `required` "yes,yes,no"). Other fields (the file itself, a piece id…) are ignored, so a
 * whole multipart form can be passed. Throws AnalysisError(400) with one plain sentence.
 */
export function parseAnalyzeOptions(fields: Record<string, string | undefined>): AnalyzeOptions {
  const raw: Record<string, unknown> = {}
  const value = (key: string) => {
    const v = fields[key]
    return v === undefined || v.trim() === '' ? undefined : v.trim()
  }
  const note = value('note')
  if (note !== undefined) raw.note = note
  for (const key of NUMBER_FIELDS) {
    const v = value(key)
    if (v !== undefined) raw[key] = toNumber(v, FIELD_NAMES[key]!)
  }
  for (const key of ['ratios', 'tolerances'] as const) {
    const v = value(key)
    if (v !== undefined) raw[key] = splitList(v).map(item => toNumber(item, FIELD_NAMES[key]!))
  }
  const labels = value('labels')
  if (labels !== undefined) raw.labels = splitList(labels)
  const required = value('required')
  if (required !== undefined) raw.required = splitList(required).map(toBoolean)
  return validateAnalyzeOptions(raw)
}

/** Validate an options object against AnalyzeOptionsSchema; AnalysisError(400) on failure. */
export function validateAnalyzeOptions(options: unknown): AnalyzeOptions {
  const parsed = AnalyzeOptionsSchema.safeParse(options ?? {})
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!
    const message = issue.code === 'unrecognized_keys' ? `"${issue.keys[0]}" is not an analysis option.` : issue.message
    throw new AnalysisError(400, 'bad_option', message)
  }
  return parsed.data
}

function splitList(text: string): string[] {
  return text.split(',').map(s => s.trim())
}

function toNumber(text: string, what: string): number {
  const n = text === '' ? Number.NaN : Number(text)
  if (!Number.isFinite(n)) throw new AnalysisError(400, 'bad_option', `${what} must be a number, not "${text}".`)
  return n
}

function toBoolean(text: string): boolean {
  const t = text.toLowerCase()
  if (['1', 'true', 'yes', 'y', 'required'].includes(t)) return true
  if (['0', 'false', 'no', 'n', 'optional'].includes(t)) return false
  throw new AnalysisError(400, 'bad_option', `Each required flag must be yes or no, not "${text}".`)
}
