export { measureClockOffset, MIN_REFERENCE_TONE_S, type ClockOffset, type ClockOffsetOptions } from './measureClockOffset'
export { correctFrequencyHz } from './correctFrequencyHz'
export { calibrateRecording } from './calibrateRecording'
export { correctPartialsHz } from './correctPartialsHz'
