import type { BarGeometry } from '../../shared/barModel/types'

/** A uniform bar of rectangular section (two profile stations). */
export function uniformBar(lengthMm: number, widthMm: number, thicknessMm: number, densityKgM3: number, youngsModulusGPa: number): BarGeometry {
  return { lengthMm, widthMm, profile: [{ xMm: 0, thicknessMm }, { xMm: lengthMm, thicknessMm }], densityKgM3, youngsModulusGPa }
}

/** βL of a mode of a uniform bar from its frequency: βL = L (ω² ρA / EI)^¼, with A = w h, I = w h³ / 12. */
export function betaLOf(frequencyHz: number, bar: BarGeometry): number {
  const h = bar.profile[0]!.thicknessMm / 1000
  const omega = 2 * Math.PI * frequencyHz
  return (bar.lengthMm / 1000) * ((omega * omega * bar.densityKgM3 * 12) / (bar.youngsModulusGPa * 1e9 * h * h)) ** 0.25
}

/** Rosewood-like material. from memory: dense tropical rosewoods used for bars are about 0.9–1.1 g/cm³ with E along the grain near 20 GPa. */
export const ROSEWOOD_LIKE = { densityKgM3: 1000, youngsModulusGPa: 20 }
