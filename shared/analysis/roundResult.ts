import type { AnalysisResult } from './types'

/** Round to `digits` decimals; null passes through. */
function r(value: number, digits: number): number
function r(value: number | null, digits: number): number | null
function r(value: number | null, digits: number): number | null {
  if (value === null || !Number.isFinite(value)) return value
  const scale = 10 ** digits
  return Math.round(value * scale) / scale
}

/**
 * Round an uncertainty up to `digits` decimals (JCGM 100:2008, GUM §7.2.6: rounding up may be
 * appropriate), so a small one is never stated as 0; a value already on the grid stays.
 */
function up(value: number | null, digits: number): number | null {
  if (value === null || !Number.isFinite(value)) return value
  const scale = 10 ** digits
  return Math.ceil(value * scale - 1e-6) / scale
}

/**
 * Round a result for output, to well below what the engine can resolve:
 * 0.0001 Hz (0.003 ¢ at 65 Hz), 0.01 dB, 0.001 dB/s, 0.01 ¢ (0.001 ¢ for the cross-check
 * and uncertainty), 0.01 % for the decay uncertainty, 0.1 ms; uncertainties are rounded up.
 * Verdicts are decided before rounding.
 */
export function roundResult(result: AnalysisResult): AnalysisResult {
  const rounded: AnalysisResult = {
    ...result,
    durationS: r(result.durationS, 6),
    onsetS: r(result.onsetS, 6),
    analysisStartS: r(result.analysisStartS, 6),
    analysisEndS: r(result.analysisEndS, 6),
    fundamentalHz: r(result.fundamentalHz, 4),
    partials: result.partials.map(p => ({
      ...p,
      frequencyHz: r(p.frequencyHz, 4),
      ...(p.rawFrequencyHz === undefined ? {} : { rawFrequencyHz: r(p.rawFrequencyHz, 4) }),
      amplitudeDb: r(p.amplitudeDb, 2),
      decayDbPerS: r(p.decayDbPerS, 3),
      t60S: r(p.t60S, 3),
      r2: r(p.r2, 4),
      startS: r(p.startS, 4),
      endS: r(p.endS, 4),
      stabilityCents: r(p.stabilityCents, 3),
      beatHz: r(p.beatHz, 3),
      snrDb: r(p.snrDb, 1),
      modulationHz: r(p.modulationHz, 3),
      modulationDepthDb: r(p.modulationDepthDb, 2),
      crossCheckCents: r(p.crossCheckCents, 3),
      uncertaintyCents: up(p.uncertaintyCents, 3),
      uncertaintyDecayPct: up(p.uncertaintyDecayPct, 2),
    })),
    parameters: {
      ...result.parameters,
      windowS: r(result.parameters.windowS, 6),
      zeroPad: r(result.parameters.zeroPad, 4),
      hopS: r(result.parameters.hopS, 6),
      trackJumpCents: r(result.parameters.trackJumpCents, 3),
      bands: result.parameters.bands.map(b => ({
        windowS: r(b.windowS, 6),
        hopS: r(b.hopS, 6),
        fromHz: r(b.fromHz, 2),
        toHz: r(b.toHz, 2),
        endS: r(b.endS, 6),
      })),
    },
  }
  if (result.target) rounded.target = { ...result.target, fundamentalHz: r(result.target.fundamentalHz, 4) }
  if (result.matches) {
    rounded.matches = result.matches.map(m => ({
      ...m,
      targetHz: r(m.targetHz, 4),
      measuredHz: r(m.measuredHz, 4),
      cents: r(m.cents, 2),
      rawCents: r(m.rawCents, 2),
      normalizedCents: r(m.normalizedCents, 2),
      amplitudeDb: r(m.amplitudeDb, 2),
    }))
  }
  return rounded
}
