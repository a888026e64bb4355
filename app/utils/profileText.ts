/** A thickness profile as the lines a person types: "position mm, thickness mm" per station. */
export function profileToText(profile: readonly { xMm: number, thicknessMm: number }[]): string {
  return profile.map(p => `${p.xMm}, ${p.thicknessMm}`).join('\n')
}

/** The stations of typed lines (numbers separated by a comma, colon, semicolon or spaces); the server checks the figures. */
export function profileFromText(text: string): { xMm: number, thicknessMm: number }[] {
  return text.split('\n').map(line => line.trim()).filter(Boolean).map((line) => {
    const [x, t] = line.split(/[\s,;:]+/).map(Number)
    return { xMm: x ?? Number.NaN, thicknessMm: t ?? Number.NaN }
  })
}
