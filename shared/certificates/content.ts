import type { z } from 'zod'
import type { PartialMatch, Verdict } from '../analysis/types'
import type { CertificateContentSchema, CertificatePartialSchema, CertificatePieceSchema, RangeSchema } from '../schemas/certificateContent'
import { statesExpandedUncertainty, type PieceBudget } from '../uncertainty/evidence'
import type { DecisionRule } from '../uncertainty/types'
import { decisionRuleText, frozenBudgets, frozenCalibrations, frozenClock, frozenDecision } from './budgetContent'
import { budgetUncertaintyText } from './budgetText'
import { uncertaintyText, type StoredPartial } from './uncertaintyText'

/** One tuned partial of one piece as frozen on a certificate. */
export type CertificatePartial = z.output<typeof CertificatePartialSchema>
export type CertificatePiece = z.output<typeof CertificatePieceSchema>
export type Range = z.output<typeof RangeSchema>
/** The frozen content of a certificate; its canonical JSON is what the hash covers. */
export type CertificateContent = z.output<typeof CertificateContentSchema>

/** The set's columns a certificate reads (kept here so shared/ does not import the database schema). */
interface InstrumentSetFields {
  name: string
  model: string
  serial: string
  fromNote: string
  toNote: string
  chromatic: boolean
  buyerName: string
  buyerOrganisation: string
  buyerEmail: string
  referenceHz: number
  temperament: string
}

export interface ContentInput {
  number: string
  verificationUrl: string
  supersedes: string | null
  signedAt: Date
  signer: { name: string, role: string }
  workshop: { name: string, address: string }
  set: Pick<InstrumentSetFields, 'name' | 'model' | 'serial' | 'fromNote' | 'toNote' | 'chromatic' | 'buyerName' | 'buyerOrganisation' | 'buyerEmail' | 'referenceHz' | 'temperament'>
  scrappedCount: number
  lots: { id: string, code: string, material: string, species: string, permitNumber?: string }[]
  pieces: {
    position: number
    note: string
    targetHz: number
    lotId: string | null
    template: { name: string, version: number, referenceTemperatureC: number, temperatureCoefficientCentsPerC: number, decisionRule?: DecisionRule }
    strike: {
      temperatureC: number | null
      humidityPct: number | null
      verdict: Verdict | null
      engineVersion: string
      matches: PartialMatch[]
      /** The strike's measured partials; from engine 2 on they carry `uncertaintyCents`. */
      partials?: StoredPartial[]
    }
    overrideReason: string | null
    /** The piece's budget at its approved strike (absent: a certificate without budgets, the simple rule). */
    budget?: PieceBudget
  }[]
}

const round = (value: number, digits: number) => Number(value.toFixed(digits))
const roundOrNull = (value: number | null | undefined, digits: number) =>
  value === null || value === undefined || !Number.isFinite(value) ? null : round(value, digits)

function rangeOf(values: (number | null)[]): Range | null {
  const present = values.filter((v): v is number => v !== null && Number.isFinite(v))
  if (!present.length) return null
  return { min: round(Math.min(...present), 1), max: round(Math.max(...present), 1) }
}

const statedU = (b: { expandedUncertaintyCents: number, notAssessed: { name: string, reason: string }[] } | undefined) =>
  b && statesExpandedUncertainty(b.notAssessed) ? b.expandedUncertaintyCents : null

const signed = (n: number) => (n < 0 ? `−${Math.abs(n)}` : `+${n}`)

/** The method in two sentences: what is measured and how. */
export function methodText(engineVersions: string[]): string {
  return `Each piece was struck on the bench and recorded, and the recording was analysed by the Tonewright measurement engine (version ${engineVersions.join(', ')}): `
    + 'after the attack transient, a zero-padded short-time Fourier transform with a Blackman–Harris window finds the partials, whose frequencies are refined by parabolic interpolation and a long-window fit. '
    + 'Each tuned partial is compared with its target, the ratio of the piece\'s template times the target fundamental from the reference pitch, as a deviation in cents, 1200 · log2(measured ÷ target).'
}

export const DECISION_RULE = 'A piece passes when every required partial of its ratio template is found and its deviation is within the tolerance (|Δ| ≤ tolerance, in cents); partials marked "reported" are shown but do not decide the verdict. No allowance for measurement uncertainty is added to or taken from the tolerance (simple acceptance).'

export const SCOPE = 'These results relate only to the instrument measured, at the time and under the conditions stated.'

/** Freezes what a certificate says, from the records at the moment of signing. */
export function buildCertificateContent(input: ContentInput): CertificateContent {
  const lotById = new Map(input.lots.map(l => [l.id, l]))
  const usedLots = [...new Set(input.pieces.map(p => p.lotId).filter((id): id is string => Boolean(id)))]
    .map(id => lotById.get(id)).filter(l => l !== undefined)
    .map(l => ({ code: l.code, material: l.material, species: l.species, permitNumber: l.permitNumber ?? '' }))
    .sort((a, b) => a.code.localeCompare(b.code))
  const templates = new Map<string, { template: string, referenceTemperatureC: number, coefficientCentsPerC: number }>()
  for (const p of input.pieces) {
    const key = `${p.template.name} (v${p.template.version})`
    templates.set(key, { template: key, referenceTemperatureC: p.template.referenceTemperatureC, coefficientCentsPerC: p.template.temperatureCoefficientCentsPerC })
  }
  const normalisation = [...templates.values()]
  const temperatureC = rangeOf(input.pieces.map(p => p.strike.temperatureC))
  const humidityPct = rangeOf(input.pieces.map(p => p.strike.humidityPct))
  const withCoefficient = normalisation.filter(n => n.coefficientCentsPerC !== 0)
  const statement = !temperatureC
    ? 'No bench temperature was recorded: deviations are as measured.'
    : withCoefficient.length
      ? `Deviations are normalised to the template's reference temperature: ${withCoefficient.map(n => `${n.referenceTemperatureC} °C at ${signed(n.coefficientCentsPerC)} ¢/°C for ${n.template}`).join('; ')}.`
      : 'The templates set no temperature coefficient: deviations are as measured.'
  const engineVersions = [...new Set(input.pieces.map(p => p.strike.engineVersion))].sort()
  const withBudget = input.pieces.some(p => p.budget)
  // The budget's paragraph needs at least one partial whose U can be stated; else the older paragraph says why none is.
  const stated = input.pieces.some(p => p.budget?.partials.some(q => q.budget && statesExpandedUncertainty(q.notAssessed)))
  const rules = new Map(input.pieces.map(p => [`${p.template.name} (v${p.template.version})`, p.template.decisionRule ?? 'simple'] as const))
  const frozen = new Map(input.pieces.map(p => [p, p.budget ? frozenBudgets(p.budget) : []]))
  const clocks = frozenCalibrations(input.pieces.flatMap(p => (p.budget ? [p.budget] : [])))
  const range = input.set.fromNote === input.set.toNote
    ? input.set.fromNote
    : `${input.set.fromNote}–${input.set.toNote}${input.set.chromatic ? ', chromatic' : ', naturals'}`
  return {
    format: 'tonewright-certificate/1',
    number: input.number,
    verificationUrl: input.verificationUrl,
    supersedes: input.supersedes,
    workshop: { name: input.workshop.name, address: input.workshop.address },
    buyer: { name: input.set.buyerName, organisation: input.set.buyerOrganisation, email: input.set.buyerEmail },
    instrument: {
      name: input.set.name, model: input.set.model, serial: input.set.serial, range,
      pieceCount: input.pieces.length, scrappedCount: input.scrappedCount, lots: usedLots,
    },
    referenceHz: input.set.referenceHz,
    temperament: input.set.temperament === 'equal' ? 'equal temperament' : input.set.temperament,
    conditions: { temperatureC, humidityPct, strikeCount: input.pieces.length, normalisation, statement },
    method: methodText(engineVersions),
    decisionRule: withBudget ? decisionRuleText(rules) : DECISION_RULE,
    uncertainty: stated
      ? budgetUncertaintyText([...frozen.values()].map(budget => ({ budget })))
      : uncertaintyText(input.pieces.map(p => ({ engineVersion: p.strike.engineVersion, matches: p.strike.matches, partials: p.strike.partials ?? [] }))),
    engineVersions,
    calibrations: clocks.calibrations,
    uncalibratedPieceCount: withBudget ? clocks.uncalibratedPieceCount : null,
    pieces: [...input.pieces].sort((a, b) => a.position - b.position).map(p => ({
      position: p.position,
      note: p.note,
      targetHz: round(p.targetHz, 3),
      template: `${p.template.name} (v${p.template.version})`,
      lot: p.lotId ? lotById.get(p.lotId)?.code ?? null : null,
      temperatureC: roundOrNull(p.strike.temperatureC, 1),
      humidityPct: roundOrNull(p.strike.humidityPct, 0),
      partials: p.strike.matches.map(m => ({
        label: m.label,
        targetHz: round(m.targetHz, 3),
        measuredHz: roundOrNull(m.measuredHz, 3),
        cents: roundOrNull(m.cents, 1),
        toleranceCents: m.toleranceCents,
        required: m.required,
        within: m.within,
        missing: m.missing,
        expandedUncertaintyCents: statedU(frozen.get(p)!.find(b => b.label === m.label)),
      })),
      verdict: p.strike.verdict ?? 'incomplete',
      overrideReason: p.overrideReason,
      decision: p.budget ? frozenDecision(p.budget) : null,
      budget: frozen.get(p)!,
      clock: p.budget ? frozenClock(p.budget) : null,
    })),
    signer: input.signer,
    signedAt: input.signedAt.toISOString(),
    scope: SCOPE,
  }
}
