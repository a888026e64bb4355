/** Mains frequencies, Hz. source: IEC 60038:2009, standard voltages (50 Hz and 60 Hz systems) */
export const MAINS_HZ = [50, 60] as const

export interface MainsHumSettings {
  /** A line of hum decays no faster than this, dB/s (a struck piece's slowest partials fall faster). */
  maxDecayDbPerS: number
  /** How far a line may lie from a whole multiple of the mains frequency, as a fraction of it (a grid drifts by tenths of a Hz). */
  tolerance: number
  /** Highest multiple looked at. */
  maxHarmonic: number
}

/** The mains frequency whose hum the readings hold, and the readings that are its lines, lowest first. */
export interface MainsHum {
  mainsHz: number
  linesHz: number[]
}

const DEFAULTS: MainsHumSettings = { maxDecayDbPerS: 0.5, tolerance: 0.004, maxHarmonic: 12 }

/**
 * Mains hum among the readings: two or more readings that do not decay and lie on whole
 * multiples of one mains frequency (a recorder's cable picking up the supply gives its
 * fundamental and harmonics at a steady level; a struck piece's partials all decay and are not
 * spaced on a 50 or 60 Hz grid). The mains frequency with more such lines wins; null when
 * neither has two.
 */
export function findMainsHum(
  readings: readonly { frequencyHz: number, decayDbPerS: number }[],
  settings: MainsHumSettings = DEFAULTS,
): MainsHum | null {
  let best: MainsHum | null = null
  for (const mainsHz of MAINS_HZ) {
    const linesHz = readings
      .filter((r) => {
        const k = Math.round(r.frequencyHz / mainsHz)
        return k >= 1 && k <= settings.maxHarmonic
          && Math.abs(r.frequencyHz - k * mainsHz) <= settings.tolerance * k * mainsHz
          && Math.abs(r.decayDbPerS) <= settings.maxDecayDbPerS
      })
      .map(r => r.frequencyHz)
      .sort((a, b) => a - b)
    if (linesHz.length >= 2 && (!best || linesHz.length > best.linesHz.length)) best = { mainsHz, linesHz }
  }
  return best
}

/** The Bench's sentence for hum found in a strike, or null. */
export function mainsHumWarning(hum: MainsHum | null): string | null {
  if (!hum) return null
  const lines = hum.linesHz.map(f => `${f.toFixed(2)} Hz`)
  const listed = lines.length === 2 ? lines.join(' and ') : `${lines.slice(0, -1).join(', ')} and ${lines[lines.length - 1]}`
  return `${listed} are mains hum, not the piece: they sit on multiples of ${hum.mainsHz} Hz and do not decay. Keep the microphone's cable away from power leads, or use a balanced cable`
}
