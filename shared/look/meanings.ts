import { PIECE_STAGES, STAGE_LABELS, type PieceStage } from '../records/stages'
import type {
  CertificatePdfStatus, CertificateStatus, MailStatus, PartialState, PieceVerdict, ReanalysisStatus,
} from '../records/lists'
import { familyOf, hex, type Family, type Tone } from './palette'

/**
 * One meaning, one look: every verdict, stage and status the screens, the e-mails and
 * the certificate show is told by a colour, a shape and a word taken from this map, and
 * no two meanings share a colour. The verdict families (spruce, kiln, slate) and the
 * message families (madder, heather) belong to their group alone, so a verdict never
 * looks like an error, a notice, a piece of advice or a stage.
 */
export type Shape = 'disc' | 'triangle-up' | 'triangle-down' | 'open-square' | 'ring' | 'crossed-square' | 'check' | 'cross' | 'clock' | 'dot-ring' | 'swatch' | 'warning-sign' | 'return-arrow' | 'half-disc'

export type LookGroup = 'verdict' | 'stage' | 'status' | 'message' | 'advice'

export interface Look {
  group: LookGroup
  /** The meaning's own colour: the mark, the stage fill, a badge's border. */
  colour: Tone
  /** Readable text in this meaning on paper. */
  text: Tone
  /** A light background in this meaning (bands, badges, alerts). */
  tint: Tone
  /** A light edge around the tint. */
  edge: Tone
  /** Text drawn on `colour` (stage badges). */
  onColour: Tone
  /** A chart marker where it sits on the tint (a stronger shade where needed). */
  marker: Tone
  /** The mark's edge when its colour alone is too light to stand out from the paper (the warning sign). */
  outline?: Tone
  shape: Shape
  word: string
}

type Shades = { colour: Tone, text: Tone, tint: Tone, edge: Tone, marker?: Tone }

function look(group: LookGroup, shades: Shades, shape: Shape, word: string): Look {
  return { group, onColour: 'paper', marker: shades.colour, ...shades, shape, word }
}

function stage(s: PieceStage, colour: Tone, onColour: Tone): Look {
  return { group: 'stage', colour, text: 'ink', tint: 'paper-deep', edge: 'paper-line', onColour, marker: colour, shape: 'swatch', word: STAGE_LABELS[s] }
}

export const MEANINGS = {
  // A partial (or a piece by its worst partial): within its band, sharp or flat outside it, missing.
  within: look('verdict', { colour: 'spruce-500', text: 'spruce-700', tint: 'spruce-50', edge: 'spruce-100', marker: 'spruce-600' }, 'disc', 'within'),
  sharp: look('verdict', { colour: 'kiln-500', text: 'kiln-700', tint: 'kiln-50', edge: 'kiln-100' }, 'triangle-up', 'sharp'),
  flat: look('verdict', { colour: 'slate-500', text: 'slate-700', tint: 'slate-50', edge: 'slate-100' }, 'triangle-down', 'flat'),
  // Under guarded acceptance: the tolerance lies within the deviation ± U, so neither pass nor fail can be claimed.
  conditional: look('verdict', { colour: 'lichen-500', text: 'lichen-700', tint: 'lichen-50', edge: 'lichen-100' }, 'half-disc', 'conditional'),
  missing: look('verdict', { colour: 'ink-faint', text: 'ink-soft', tint: 'paper-deep', edge: 'paper-line' }, 'open-square', 'missing'),
  // Piece stages: paper before tuning, brass while tuned, lagoon once signed off,
  // mulberry when sent back, greyed ink when out of the flow.
  blank: stage('blank', 'paper-deep', 'ink'),
  roughed: stage('roughed', 'paper-line', 'ink'),
  tuning: stage('tuning', 'brass-400', 'ink'),
  review: stage('review', 'brass-700', 'paper'),
  approved: stage('approved', 'lagoon-500', 'paper'),
  certified: stage('certified', 'lagoon-700', 'paper'),
  shipped: stage('shipped', 'ink-soft', 'paper'),
  rework: stage('rework', 'mulberry-500', 'paper'),
  scrapped: stage('scrapped', 'ink-mute', 'ink'),
  // Certificates, e-mails and background work.
  valid: look('status', { colour: 'lagoon-600', text: 'lagoon-700', tint: 'lagoon-50', edge: 'lagoon-100' }, 'disc', 'valid'),
  superseded: look('status', { colour: 'brass-500', text: 'brass-700', tint: 'brass-100', edge: 'brass-400' }, 'ring', 'superseded'),
  revoked: look('status', { colour: 'mulberry-700', text: 'mulberry-700', tint: 'mulberry-50', edge: 'mulberry-100' }, 'crossed-square', 'revoked'),
  waiting: look('status', { colour: 'ink', text: 'ink-soft', tint: 'paper-deep', edge: 'paper-line' }, 'clock', 'waiting'),
  done: look('status', { colour: 'lagoon-400', text: 'lagoon-700', tint: 'lagoon-50', edge: 'lagoon-100' }, 'check', 'done'),
  // A shipped set booked back in for retuning or repair (an open service record).
  inService: look('status', { colour: 'mulberry-600', text: 'mulberry-700', tint: 'mulberry-50', edge: 'mulberry-100' }, 'return-arrow', 'in service'),
  // Messages: something went wrong, or something to know.
  error: look('message', { colour: 'madder-500', text: 'madder-700', tint: 'madder-50', edge: 'madder-100' }, 'cross', 'error'),
  info: look('message', { colour: 'heather-500', text: 'heather-700', tint: 'heather-50', edge: 'heather-100' }, 'dot-ring', 'note'),
  // A warning or caution: safety yellow with a black edge, as ISO 3864-1 draws warning signs.
  warning: { ...look('message', { colour: 'signal-400', text: 'signal-800', tint: 'signal-50', edge: 'signal-100' }, 'warning-sign', 'caution'), onColour: 'ink', outline: 'ink' },
  // Advice at the bench: where to remove material (never drawn like sharp or flat).
  advice: look('advice', { colour: 'brass-600', text: 'brass-700', tint: 'brass-100', edge: 'brass-400' }, 'swatch', 'remove material here'),
} as const satisfies Record<string, Look>

export type Meaning = keyof typeof MEANINGS

/** Families that only one group may use (ink and paper are neutral and shared). */
export const NEUTRAL_FAMILIES: readonly Family[] = ['ink', 'paper']

export const PARTIAL_MEANING: Record<PartialState, Meaning> = { within: 'within', sharp: 'sharp', flat: 'flat', missing: 'missing' }
export const STAGE_MEANING: Record<PieceStage, Meaning> = Object.fromEntries(PIECE_STAGES.map(s => [s, s])) as Record<PieceStage, Meaning>
export const CERTIFICATE_MEANING: Record<CertificateStatus, Meaning> = { valid: 'valid', superseded: 'superseded', revoked: 'revoked' }
export const CERTIFICATE_PDF_MEANING: Record<CertificatePdfStatus, Meaning> = { pending: 'waiting', ready: 'done' }
export const MAIL_MEANING: Record<MailStatus, Meaning> = { queued: 'waiting', sent: 'done', failed: 'error' }
/** What a message box says: something went wrong, something to take care with, something to know, something done. */
export const MESSAGE_TONES = ['error', 'warning', 'info', 'success'] as const
export type MessageTone = (typeof MESSAGE_TONES)[number]
export const MESSAGE_MEANING: Record<MessageTone, Meaning> = { error: 'error', warning: 'warning', info: 'info', success: 'done' }
export const REANALYSIS_MEANING: Record<ReanalysisStatus, Meaning> = { queued: 'waiting', running: 'waiting', done: 'done', failed: 'error' }

/**
 * A piece's verdict shown by its worst partial: within, sharp or flat by the sign of the
 * worst deviation, or missing when incomplete (or when the deviation is unknown).
 */
export function verdictMeaning(verdict: PieceVerdict, worstCents: number | null | undefined): PartialState & Meaning {
  if (verdict === 'within') return 'within'
  if (verdict === 'incomplete' || worstCents === null || worstCents === undefined) return 'missing'
  return worstCents > 0 ? 'sharp' : 'flat'
}

/** A verdict under a decision rule: pass looks within, fail sharp or flat by the deviation's sign, conditional its own; none is missing. */
export function decisionMeaning(verdict: 'pass' | 'conditional' | 'fail' | null, cents: number | null): Meaning {
  if (verdict === null || cents === null) return 'missing'
  if (verdict === 'pass') return 'within'
  if (verdict === 'conditional') return 'conditional'
  return cents > 0 ? 'sharp' : 'flat'
}

/** A look's colours as hex, for canvas charts, e-mails and the PDF. */
export function lookHex(meaning: Meaning): { colour: string, text: string, tint: string, edge: string, onColour: string, marker: string } {
  const l: Look = MEANINGS[meaning]
  return { colour: hex(l.colour), text: hex(l.text), tint: hex(l.tint), edge: hex(l.edge), onColour: hex(l.onColour), marker: hex(l.marker) }
}

/** Every tone a look uses, with its family (for the checks that keep looks apart). */
export function lookTones(l: Look): { tone: Tone, family: Family }[] {
  return [l.colour, l.text, l.tint, l.edge, l.onColour, l.marker, ...(l.outline ? [l.outline] : [])].map(tone => ({ tone, family: familyOf(tone) }))
}

/**
 * Tailwind classes for a look (`fill-spruce-500`, `text-spruce-700`...). They are built
 * here rather than written in the components, so tailwind.config.ts keeps them with
 * `lookClassNames()`.
 */
export function lookClasses(meaning: Meaning) {
  const l: Look = MEANINGS[meaning]
  return {
    fill: `fill-${l.colour}`,
    stroke: `stroke-${l.colour}`,
    border: `border-${l.colour}`,
    text: `text-${l.text}`,
    tint: `bg-${l.tint}`,
    edge: `border-${l.edge}`,
    bandFill: `fill-${l.edge}`,
    softFill: `fill-${l.tint}`,
    marker: `fill-${l.marker}`,
    background: `bg-${l.colour}`,
    outline: l.outline ? `stroke-${l.outline}` : '',
  }
}

/** Every class `lookClasses` can return, for Tailwind's safelist. */
export function lookClassNames(): string[] {
  return [...new Set((Object.keys(MEANINGS) as Meaning[]).flatMap(m => Object.values(lookClasses(m))))].filter(Boolean)
}
