/**
 * Materials a bar or plate is cut from, with the figures a piece's geometry starts from
 * until a blank's grade or a hand entry gives better ones. Density and Young's modulus along
 * the grain are typical values, from memory; real stock varies by ±20 % and more for wood.
 */
export const BAR_MATERIALS = {
  rosewood: { label: 'Rosewood', densityKgM3: 1000, youngsModulusGPa: 20 },
  padauk: { label: 'Padauk', densityKgM3: 750, youngsModulusGPa: 13 },
  aluminium: { label: 'Aluminium', densityKgM3: 2700, youngsModulusGPa: 69 },
  steel: { label: 'Steel', densityKgM3: 7850, youngsModulusGPa: 200 },
  bronze: { label: 'Bronze', densityKgM3: 8800, youngsModulusGPa: 110 },
} as const

export type BarMaterial = keyof typeof BAR_MATERIALS
export const BAR_MATERIAL_NAMES = Object.keys(BAR_MATERIALS) as [BarMaterial, ...BarMaterial[]]

/** The material named in free text (a lot's species or material), if it is one we know. */
export function barMaterialIn(text: string | null | undefined): BarMaterial | null {
  const words = (text ?? '').toLowerCase()
  if (words.includes('aluminum')) return 'aluminium'
  return BAR_MATERIAL_NAMES.find(m => words.includes(m)) ?? null
}
