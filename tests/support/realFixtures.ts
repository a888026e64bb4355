// Recordings of real struck instruments for the accuracy tests, made at test time into a
// git-ignored cache (.data/fixtures/real): freepats patches (GPL) rendered note by note
// with timidity, sonic-pi-samples strokes (CC0) converted with sox. Sources, licences and
// the manual readings are in tests/fixtures/real/README.md and expected.json.
import { execFileSync } from 'node:child_process'
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { midiNote } from './midiNote'

// A bundle of a script that reads the fixtures runs from elsewhere; scripts/run-built.mjs names the project for it.
const ROOT = process.env.TONEWRIGHT_ROOT ?? fileURLToPath(new URL('../../', import.meta.url))
export const REAL_FIXTURE_DIR = join(ROOT, '.data', 'fixtures', 'real')
const EXPECTED_PATH = join(ROOT, 'tests', 'fixtures', 'real', 'expected.json')
const FREEPATS_CFG = '/etc/timidity/freepats.cfg'
const SONIC_PI_SAMPLES = '/usr/share/sonic-pi/samples'

/** A reference partial from the manual reading (see README.md). */
export interface ReferencePartial {
  frequencyHz: number
  amplitudeDb: number
}

/** One fixture recording with how to make it and what it holds. */
export interface RealFixture {
  id: string
  family: string
  source: { kind: 'freepats', program: number, note: number } | { kind: 'sonic-pi', sample: string }
  /** Target fundamental a workshop would give for this note, in Hz. */
  targetHz: number
  /** The family's ratio template as given on the Bench. */
  ratios: number[]
  /** The three lowest of the five strongest partials, from the manual reading. */
  reference: ReferencePartial[]
}

export function realFixtures(): RealFixture[] {
  return JSON.parse(readFileSync(EXPECTED_PATH, 'utf8')) as RealFixture[]
}

function tool(name: string): string {
  for (const dir of ['/usr/bin', '/usr/local/bin', '/bin']) if (existsSync(join(dir, name))) return join(dir, name)
  throw new Error(`${name} is not installed; run scripts/test.sh once (it installs timidity, freepats, sox and sonic-pi-samples) or apt-get install them`)
}

/** Path of the fixture's WAV file, made on first use (in `cacheDir`, the fixtures' cache unless told). */
export function realFixturePath(fixture: Pick<RealFixture, 'id' | 'source'>, cacheDir = REAL_FIXTURE_DIR): string {
  const out = join(cacheDir, `${fixture.id}.wav`)
  if (existsSync(out)) return out
  mkdirSync(cacheDir, { recursive: true })
  const partial = `${out}.${process.pid}.tmp.wav`
  const source = fixture.source
  if (source.kind === 'freepats') {
    if (!existsSync(FREEPATS_CFG)) throw new Error('freepats is not installed (no /etc/timidity/freepats.cfg)')
    const midi = `${out}.${process.pid}.mid`
    // Held 4 s so the patch rings out; timidity stops when the sound has died away.
    writeFileSync(midi, midiNote(source.program, source.note, 100, 4, 0.5))
    // Mono 16-bit at 48 kHz, no reverb or chorus: the patch as it was sampled.
    execFileSync(tool('timidity'), ['-c', FREEPATS_CFG, '-OwM', '-s', '48000', '-EFreverb=0', '-EFchorus=0', '-idq', '-o', partial, midi], { stdio: 'ignore' })
    execFileSync('rm', ['-f', midi])
  }
  else {
    const flac = join(SONIC_PI_SAMPLES, `${source.sample}.flac`)
    if (!existsSync(flac)) throw new Error(`sonic-pi-samples is not installed (no ${flac})`)
    execFileSync(tool('sox'), [flac, '-b', '16', '-c', '1', partial], { stdio: 'ignore' })
  }
  mkdirSync(dirname(out), { recursive: true })
  renameSync(partial, out)
  return out
}
