import type { PartialMatch } from './types'

function formatCents(cents: number): string {
  return `${Math.abs(cents).toFixed(1)} ¢`
}

/**
 * One plain sentence per partial that is outside its tolerance: which partial, how many
 * cents, sharp or flat, against which tolerance.
 */
export function guidanceLines(matches: readonly PartialMatch[]): string[] {
  const lines: string[] = []
  for (const m of matches) {
    if (m.missing || m.within || m.cents === null || m.measuredHz === null) continue
    const direction = m.cents > 0 ? 'sharp' : 'flat'
    const optional = m.required ? '' : ' (not required)'
    lines.push(
      `${capitalise(m.label)}${optional} is ${formatCents(m.cents)} ${direction}: measured ${m.measuredHz.toFixed(2)} Hz, `
      + `target ${m.targetHz.toFixed(2)} Hz, tolerance ±${m.toleranceCents} ¢.`,
    )
  }
  return lines
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1)
}
