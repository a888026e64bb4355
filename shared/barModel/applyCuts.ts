import { thicknessAtMm } from './thicknessAtMm'
import type { ProfileStation } from './types'

/**
 * The profile after removing material: the removal depth is linear between the cut
 * stations (as the thickness is between profile stations) and zero beyond the outer
 * ones, so each cut tapers to nothing at its neighbouring stations. The result has a
 * station wherever either had one, and is exactly the thickness minus the depth.
 */
export function applyCuts(profile: readonly ProfileStation[], cuts: readonly { xMm: number, depthMm: number }[]): ProfileStation[] {
  if (profile.length < 2) throw new RangeError('a profile needs at least two stations')
  cuts.forEach((c, i) => {
    if (!Number.isFinite(c.xMm) || !Number.isFinite(c.depthMm) || c.depthMm < 0) throw new RangeError('cut depths must be finite and not negative')
    if (i > 0 && !(c.xMm > cuts[i - 1]!.xMm)) throw new RangeError('cut stations must go from left to right without repeats')
  })
  const depths = cuts.map(c => ({ xMm: c.xMm, thicknessMm: c.depthMm }))
  const start = profile[0]!.xMm
  const end = profile[profile.length - 1]!.xMm
  const xs = [...profile.map(p => p.xMm), ...cuts.map(c => c.xMm).filter(x => x > start && x < end)].sort((a, b) => a - b)
  const out: ProfileStation[] = []
  for (const x of xs) {
    if (out.length > 0 && x - out[out.length - 1]!.xMm < 1e-9) continue
    out.push({ xMm: x, thicknessMm: thicknessAtMm(profile, x) - depthAtMm(depths, x) })
  }
  return out
}

function depthAtMm(depths: readonly ProfileStation[], x: number): number {
  if (depths.length === 0 || x < depths[0]!.xMm || x > depths[depths.length - 1]!.xMm) return 0
  return thicknessAtMm(depths, x)
}
