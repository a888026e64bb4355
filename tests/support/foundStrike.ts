import { ENGINE_SETTINGS } from '../../shared/analysis/engineSettings'
import { findStrike, type StrikeSpan } from '../../shared/analysis/findStrike'
import { synthStrike, type SynthOptions, type SynthPartial } from './synthStrike'

/** Test builder: a synthetic strike and where findStrike places it, skipping the engine's usual attack. */
export function foundStrike(partials: SynthPartial[], options: SynthOptions): { signal: Float64Array, strike: StrikeSpan } {
  const signal = synthStrike(partials, options)
  return { signal, strike: findStrike(signal, options.sampleRate, { attackSkipS: ENGINE_SETTINGS.attackSkipS }) }
}
