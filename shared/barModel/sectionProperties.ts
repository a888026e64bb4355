/** Per-metre properties of a rectangular section: bending stiffness EI (N·m²), mass ρA (kg/m) and rotary inertia ρI (kg·m). */
export function sectionProperties(thicknessM: number, widthM: number, densityKgM3: number, youngsModulusPa: number): { bendingStiffness: number, massPerLength: number, rotaryInertia: number } {
  if (!(thicknessM > 0) || !(widthM > 0)) throw new RangeError('section needs a positive thickness and width')
  const area = widthM * thicknessM
  const second = widthM * thicknessM ** 3 / 12
  return { bendingStiffness: youngsModulusPa * second, massPerLength: densityKgM3 * area, rotaryInertia: densityKgM3 * second }
}
