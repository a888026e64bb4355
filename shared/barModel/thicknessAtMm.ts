import type { ProfileStation } from './types'

/** Thickness of a profile at xMm, linear between stations and held at the ends beyond them. */
export function thicknessAtMm(profile: readonly ProfileStation[], xMm: number): number {
  if (profile.length === 0) throw new RangeError('a profile needs at least one station')
  const first = profile[0]!
  if (xMm <= first.xMm) return first.thicknessMm
  for (let i = 1; i < profile.length; i++) {
    const b = profile[i]!
    if (xMm <= b.xMm) {
      const a = profile[i - 1]!
      const span = b.xMm - a.xMm
      return span > 0 ? a.thicknessMm + (b.thicknessMm - a.thicknessMm) * (xMm - a.xMm) / span : b.thicknessMm
    }
  }
  return profile[profile.length - 1]!.thicknessMm
}
