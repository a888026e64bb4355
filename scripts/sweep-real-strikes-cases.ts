// The strikes of the sweep (scripts/sweep-real-strikes.ts): only the fixtures' own sources
// (tests/fixtures/real/README.md). Freepats: every tuned-percussion patch it holds, over a
// range a maker of that instrument would tune, every 3–4 semitones; sonic-pi-samples: the
// bells, every tabla stroke and the pitched drums.
import type { RealFixture } from '../tests/support/realFixtures'

export type SweepCase = Pick<RealFixture, 'id' | 'source' | 'family' | 'ratios'>

const NAMES = ['c', 'c#', 'd', 'd#', 'e', 'f', 'f#', 'g', 'g#', 'a', 'a#', 'b']
const noteName = (midi: number) => `${NAMES[midi % 12]!.replace('#', 's')}${Math.floor(midi / 12) - 1}`

interface Patch { family: string, slug: string, program: number, ratios: number[], lowest: number, highest: number, step: number }

// Ratio templates as the fixtures give them (expected.json); wood block: its note alone.
const PATCHES: Patch[] = [
  { family: 'celesta', slug: 'celesta', program: 8, ratios: [1], lowest: 60, highest: 100, step: 4 },
  { family: 'glockenspiel', slug: 'glockenspiel', program: 9, ratios: [1, 2.76, 5.4], lowest: 77, highest: 105, step: 4 },
  { family: 'xylophone', slug: 'xylophone', program: 13, ratios: [1, 3, 6], lowest: 65, highest: 101, step: 4 },
  { family: 'chimes', slug: 'tubular-bells', program: 14, ratios: [2, 3, 4], lowest: 60, highest: 78, step: 3 },
  { family: 'timpani', slug: 'timpani', program: 47, ratios: [1, 1.5, 2], lowest: 38, highest: 59, step: 3 },
  { family: 'steel drum', slug: 'steel-drum', program: 114, ratios: [1, 2, 4], lowest: 55, highest: 83, step: 4 },
  { family: 'wood block', slug: 'wood-block', program: 115, ratios: [1], lowest: 60, highest: 84, step: 6 },
]

const TABLA = ['dhec', 'ghe1', 'ghe2', 'ghe3', 'ghe4', 'ghe5', 'ghe6', 'ghe7', 'ghe8', 'ke1', 'ke2', 'ke3', 'na', 'na_o', 'na_s', 're', 'tas1', 'tas2', 'tas3', 'te1', 'te2', 'te_m', 'te_ne', 'tun1', 'tun2', 'tun3']

export const SWEEP_CASES: SweepCase[] = [
  ...PATCHES.flatMap((p) => {
    const notes: number[] = []
    for (let n = p.lowest; n <= p.highest; n += p.step) notes.push(n)
    return notes.map(note => ({ id: `${p.slug}-${noteName(note)}`, family: p.family, ratios: p.ratios, source: { kind: 'freepats' as const, program: p.program, note } }))
  }),
  ...['perc_bell', 'perc_bell2', 'drum_cowbell'].map(sample => ({ id: sample, family: 'bell', ratios: [1, 2.76, 5.4], source: { kind: 'sonic-pi' as const, sample } })),
  ...TABLA.map(s => ({ id: `tabla_${s}`, family: 'tabla', ratios: [1], source: { kind: 'sonic-pi' as const, sample: `tabla_${s}` } })),
  ...['lo', 'mid', 'hi'].flatMap(h => ['soft', 'hard'].map(v => ({ id: `drum_tom_${h}_${v}`, family: 'tom', ratios: [1], source: { kind: 'sonic-pi' as const, sample: `drum_tom_${h}_${v}` } }))),
]
