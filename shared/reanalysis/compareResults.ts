import { isOneOf, PIECE_VERDICTS, type PieceVerdict } from '../records/lists'

/**
 * What changed between two results of the same strike (before and after a
 * re-measurement): engine version, verdict, worst deviation and each template
 * partial's cents. Pure, so the server, the CLI and the screens agree.
 */

/** A deviation change smaller than this is below what the screens print (0.1 ¢) and counts as unchanged. */
export const CENTS_CHANGE_THRESHOLD = 0.05

/** The parts of a stored result a comparison reads (older engines may lack fields). */
export interface ResultSummary {
  engineVersion: string
  verdict: PieceVerdict | null
  worstCents: number | null
  matches: { label: string, ratio: number, cents: number | null, within: boolean, missing: boolean }[]
}

export interface PartialChange {
  label: string
  ratio: number
  oldCents: number | null
  newCents: number | null
  /** new − old in cents; null when either side was not measured. */
  changeCents: number | null
  oldWithin: boolean | null
  newWithin: boolean | null
  changed: boolean
}

export interface ResultChange {
  oldEngineVersion: string
  newEngineVersion: string
  oldVerdict: PieceVerdict | null
  newVerdict: PieceVerdict | null
  oldWorstCents: number | null
  newWorstCents: number | null
  verdictChanged: boolean
  /** Largest |new − old| over the partials measured both times, in cents. */
  largestChangeCents: number | null
  partials: PartialChange[]
  changed: boolean
}

const key = (m: { label: string, ratio: number }) => `${m.ratio}|${m.label}`

export function compareResults(before: ResultSummary, after: ResultSummary): ResultChange {
  const oldByKey = new Map(before.matches.map(m => [key(m), m]))
  const newByKey = new Map(after.matches.map(m => [key(m), m]))
  const keys = [...new Set([...oldByKey.keys(), ...newByKey.keys()])]
  const partials: PartialChange[] = keys.map((k) => {
    const o = oldByKey.get(k)
    const n = newByKey.get(k)
    const oldCents = o && !o.missing ? o.cents : null
    const newCents = n && !n.missing ? n.cents : null
    const changeCents = oldCents !== null && newCents !== null ? newCents - oldCents : null
    const oldWithin = o ? o.within : null
    const newWithin = n ? n.within : null
    const changed = (changeCents !== null && Math.abs(changeCents) >= CENTS_CHANGE_THRESHOLD)
      || (oldCents === null) !== (newCents === null) || oldWithin !== newWithin
    return { label: (n ?? o)!.label, ratio: (n ?? o)!.ratio, oldCents, newCents, changeCents, oldWithin, newWithin, changed }
  }).sort((a, b) => a.ratio - b.ratio)
  const changes = partials.map(p => p.changeCents).filter((c): c is number => c !== null).map(Math.abs)
  const verdictChanged = before.verdict !== after.verdict
  return {
    oldEngineVersion: before.engineVersion,
    newEngineVersion: after.engineVersion,
    oldVerdict: before.verdict,
    newVerdict: after.verdict,
    oldWorstCents: before.worstCents,
    newWorstCents: after.worstCents,
    verdictChanged,
    largestChangeCents: changes.length ? Math.max(...changes) : null,
    partials,
    changed: verdictChanged || partials.some(p => p.changed),
  }
}

/** Reads a stored analysis JSON defensively into the summary a comparison needs. */
export function summarise(engineVersion: string, verdict: string | null, worstCents: number | null, analysis: unknown): ResultSummary {
  const raw = (analysis && typeof analysis === 'object' ? (analysis as { matches?: unknown }).matches : null)
  const matches = Array.isArray(raw)
    ? raw.filter((m): m is Record<string, unknown> => Boolean(m) && typeof m === 'object').map(m => ({
        label: String(m.label ?? ''),
        ratio: typeof m.ratio === 'number' ? m.ratio : 0,
        cents: typeof m.cents === 'number' && Number.isFinite(m.cents) ? m.cents : null,
        within: m.within === true,
        missing: m.missing === true,
      }))
    : []
  return { engineVersion, verdict: isOneOf(PIECE_VERDICTS, verdict) ? verdict : null, worstCents, matches }
}
