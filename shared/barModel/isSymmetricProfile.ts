import { thicknessAtMm } from './thicknessAtMm'
import type { ProfileStation } from './types'

/** True when the profile reads the same from either end (within 1 µm), so cuts can be planned in mirrored pairs. */
export function isSymmetricProfile(profile: readonly ProfileStation[], lengthMm: number): boolean {
  if (profile.length < 2) throw new RangeError('a profile needs at least two stations')
  return profile.every(s => Math.abs(thicknessAtMm(profile, lengthMm - s.xMm) - s.thicknessMm) < 1e-3)
}
