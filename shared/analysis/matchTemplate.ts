import { centsBetween } from './centsBetween'
import { templateSearchWindows } from './templateSearchWindows'
import type { MeasuredPartial, PartialMatch, RatioTemplateInput } from './types'

/**
 * Match each template partial to the strongest measured partial within its search
 * window around ratio × `fundamentalHz` (the template's window, narrowed to half the
 * distance to the neighbouring template partials so that two never claim the same
 * partial). Cents are 1200 · log2(measured / target). With a bench temperature the
 * cents are also normalised to the template's reference temperature,
 * normalised = raw − coefficient × (temperatureC − referenceTemperatureC), and the
 * normalised value decides `within`.
 */
export function matchTemplate(
  partials: readonly MeasuredPartial[],
  template: Required<RatioTemplateInput>,
  fundamentalHz: number,
  temperatureC?: number | null,
): PartialMatch[] {
  const specs = template.partials
  const targets = specs.map(s => s.ratio * fundamentalHz)
  const hasTemperature = temperatureC !== undefined && temperatureC !== null
  const shiftCents = hasTemperature
    ? template.temperatureCoefficientCentsPerC * (temperatureC - template.referenceTemperatureC)
    : 0
  const windows = templateSearchWindows(targets, template.searchWindowCents)
  return specs.map((spec, i) => {
    const targetHz = targets[i]!
    const windowCents = windows[i]!
    let best: MeasuredPartial | null = null
    for (const p of partials) {
      if (Math.abs(centsBetween(p.frequencyHz, targetHz)) > windowCents) continue
      if (!best || p.amplitudeDb > best.amplitudeDb) best = p
    }
    if (!best) {
      return {
        label: spec.label,
        ratio: spec.ratio,
        targetHz,
        measuredHz: null,
        cents: null,
        rawCents: null,
        normalizedCents: null,
        toleranceCents: spec.toleranceCents,
        within: false,
        missing: true,
        required: spec.required,
        direction: null,
        amplitudeDb: null,
      }
    }
    const rawCents = centsBetween(best.frequencyHz, targetHz)
    const normalizedCents = hasTemperature ? rawCents - shiftCents : null
    const cents = normalizedCents ?? rawCents
    return {
      label: spec.label,
      ratio: spec.ratio,
      targetHz,
      measuredHz: best.frequencyHz,
      cents,
      rawCents,
      normalizedCents,
      toleranceCents: spec.toleranceCents,
      within: Math.abs(cents) <= spec.toleranceCents,
      missing: false,
      required: spec.required,
      direction: cents > 0 ? 'sharp' : cents < 0 ? 'flat' : 'on',
      amplitudeDb: best.amplitudeDb,
    }
  })
}
