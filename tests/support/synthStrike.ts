// One synthesiser for tests, demo data and benchmarks.
export { synthStrike, type SynthPartial, type SynthOptions } from '../../shared/synthesis/synthStrike'
