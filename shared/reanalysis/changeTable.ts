import { formatCents } from '../format/numbers'
import type { ReanalysisResult } from './types'

/** Counts over a re-measurement's strikes, for a one-line summary. */
export function changeCounts(result: ReanalysisResult) {
  const strikes = result.pieces.flatMap(p => p.strikes.map(s => ({ ...s, signed: p.signed })))
  return {
    pieces: result.pieces.length,
    strikes: strikes.length,
    measured: strikes.filter(s => s.change).length,
    changed: strikes.filter(s => s.change?.changed).length,
    verdictChanged: strikes.filter(s => s.change?.verdictChanged).length,
    keptOnSigned: strikes.filter(s => s.change && s.signed).length,
    failed: strikes.filter(s => s.error).length,
  }
}

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`

export function changeSummary(result: ReanalysisResult): string {
  const c = changeCounts(result)
  const parts = [
    `Re-measured ${plural(c.measured, 'strike', 'strikes')} of ${plural(c.pieces, 'piece', 'pieces')} with engine ${result.engineVersion}:`,
    `${c.changed} changed, ${plural(c.verdictChanged, 'verdict', 'verdicts')} changed`,
  ]
  let line = parts.join(' ')
  if (c.keptOnSigned) line += `, ${c.keptOnSigned} on signed pieces kept in the history only (their signed results and stages stay)`
  if (c.failed) line += `, ${c.failed} could not be measured`
  return `${line}.`
}

const arrow = (a: string, b: string) => (a === b ? a : `${a} → ${b}`)

/** A plain-text table of the strikes that changed or could not be measured, one row each. */
export function changeTable(result: ReanalysisResult): string {
  const head = ['Piece', 'Strike recorded', 'Engine', 'Verdict', 'Worst', 'Largest change', 'Note']
  const rows: string[][] = []
  for (const piece of result.pieces) {
    for (const s of piece.strikes) {
      if (!s.error && !s.change?.changed) continue
      const c = s.change
      rows.push([
        `${piece.position} ${piece.note}`,
        s.recordedAt.slice(0, 16).replace('T', ' '),
        c ? arrow(c.oldEngineVersion, c.newEngineVersion) : '—',
        c ? arrow(c.oldVerdict ?? '—', c.newVerdict ?? '—') : '—',
        c ? arrow(formatCents(c.oldWorstCents), formatCents(c.newWorstCents)) : '—',
        c?.largestChangeCents !== null && c?.largestChangeCents !== undefined ? `${c.largestChangeCents.toFixed(1)} ¢` : '—',
        s.error ?? (piece.signed ? `signed (${piece.stage}): kept in history only` : ''),
      ])
    }
  }
  if (!rows.length) return 'Nothing changed.'
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map(r => r[i]!.length)))
  const line = (r: string[]) => r.map((cell, i) => cell.padEnd(widths[i]!)).join('  ').trimEnd()
  return [line(head), line(widths.map(w => '-'.repeat(w))), ...rows.map(line)].join('\n')
}
