import type { MeasuredPartial } from './types'

/** Without a target, the fundamental is taken as the lowest partial within 20 dB of the strongest. */
export function fundamentalWithoutTarget(partials: readonly MeasuredPartial[]): MeasuredPartial | undefined {
  if (partials.length === 0) return undefined
  const strongest = Math.max(...partials.map(p => p.amplitudeDb))
  return partials.find(p => p.amplitudeDb >= strongest - 20)
}
