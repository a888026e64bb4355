import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { analyzeStrike } from '../../../../shared/analysis/index'
import { runAnalyzeCli } from '../../../support/analyzeCli'

const root = fileURLToPath(new URL('../../../../', import.meta.url))
const fixture = (name: string) => `tests/fixtures/audio/${name}`

function cli(...args: string[]) {
  const run = runAnalyzeCli(args, { timeoutMs: 60_000 })
  return { code: run.status, stdout: run.stdout, stderr: run.stderr }
}

describe('npm run analyze', () => {
  it('--json prints exactly the analysis JSON', async () => {
    const args = ['--note', 'A4', '--ratios', '1,2.7565', '--tolerances', '2,5', '--temperature-c', '24']
    const run = cli(fixture('strike-48k.flac'), ...args, '--json')
    expect(run.code).toBe(0)
    expect(run.stderr).toBe('')
    const printed = JSON.parse(run.stdout)
    const direct = await analyzeStrike(new Uint8Array(readFileSync(`${root}${fixture('strike-48k.flac')}`)), {
      note: 'A4', ratios: [1, 2.7565], tolerances: [2, 5], temperatureC: 24,
    })
    expect(printed).toEqual(JSON.parse(JSON.stringify(direct)))
    expect(printed.verdict).toBe('within')
  }, 60_000)

  it('prints a readable table with units on every number', () => {
    const run = cli(fixture('strike-48k-16bit.wav'), '--target-hz', '440', '--ratios', '1,2.7565', '--reference-hz', '442')
    expect(run.code).toBe(0)
    for (const unit of [' Hz', ' dB', ' dB/s', ' s', ' ¢']) expect(run.stdout).toContain(unit)
    expect(run.stdout).toMatch(/440\.000 Hz/)
    expect(run.stdout).toMatch(/Verdict: within/)
  }, 60_000)

  it('--json measures a WAV cut short and says so in warnings', () => {
    // A 0.8 s fixture whose data chunk is made to declare 10 s (the file still holds 0.8 s).
    const bytes = new Uint8Array(readFileSync(`${root}${fixture('strike-48k-16bit.wav')}`))
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength)
    let at = 12
    while (String.fromCharCode(...bytes.subarray(at, at + 4)) !== 'data') at += 8 + view.getUint32(at + 4, true)
    view.setUint32(at + 4, 48000 * 2 * 10, true)
    const file = join(mkdtempSync(join(tmpdir(), 'tw-cli-')), 'cut.wav')
    writeFileSync(file, bytes)
    const run = cli(file, '--target-hz', '440', '--json')
    expect(run.code).toBe(0)
    const printed = JSON.parse(run.stdout)
    expect(printed.warnings[0]).toMatch(/^truncated WAV file: the header declares 10\.00 s of audio but the file holds 0\.8\d s/)
    expect(printed.fundamentalHz).toBeCloseTo(440, 0)
  }, 60_000)

  const refusals: [string[], number, RegExp][] = [
    [[fixture('not-audio.txt')], 1, /not audio/],
    [[fixture('empty.wav')], 1, /empty/],
    [[fixture('truncated-header.wav')], 1, /truncated or its header is damaged/],
    [['tests/fixtures/audio/no-such-file.wav'], 2, /no such file/],
    [[fixture('strike-48k.flac'), '--reference-hz', '500'], 1, /between 400 and 480 Hz/],
    [[fixture('strike-48k.flac'), '--colour', 'red'], 2, /not an option/],
    [[], 2, /Usage/],
  ]
  for (const [args, code, message] of refusals) {
    it(`refuses ${args.join(' ') || '(no file)'} with one sentence and exit ${code}`, () => {
      const run = cli(...args)
      expect(run.code).toBe(code)
      expect(run.stdout).toBe('')
      expect(run.stderr).toMatch(message)
      expect(run.stderr.trim().split('\n')).toHaveLength(1)
      expect(run.stderr).not.toMatch(/\bat .*:\d+:\d+/)
    }, 60_000)
  }
})
