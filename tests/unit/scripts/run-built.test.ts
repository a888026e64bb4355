import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { analyzeStrike } from '../../../shared/analysis/index'
import { analyzeCommandWords, runAnalyzeCli } from '../../support/analyzeCli'

const root = fileURLToPath(new URL('../../../', import.meta.url))

function launcher(dir: string, ...args: string[]) {
  // package.json's Node flags and the launcher, without the script name `args` bring.
  return spawnSync(process.execPath, [...analyzeCommandWords().slice(0, -1), ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, env: { ...process.env, TONEWRIGHT_CLI_DIR: dir } })
}

/** The command `npm run analyze` runs, Node flags included, as package.json gives it. */
function npmAnalyze(dir: string, ...args: string[]) {
  expect(analyzeCommandWords()).toContain('scripts/run-built.mjs')
  return runAnalyzeCli(args, { timeoutMs: 120_000, env: { ...process.env, TONEWRIGHT_CLI_DIR: dir } })
}

describe('scripts/run-built.mjs (npm run analyze)', () => {
  it('builds the CLI when it is missing, reuses a fresh build and rebuilds a stale one', () => {
    const dir = mkdtempSync(join(tmpdir(), 'tw-cli-build-'))
    const bundle = join(dir, 'analyze', 'analyze.mjs')
    const inputs = join(dir, 'analyze', 'inputs.json')

    const first = launcher(dir, 'analyze', '--help')
    expect(first.status).toBe(2)
    expect(first.stderr).toMatch(/^Usage: npm run analyze -- FILE/)
    const recorded = JSON.parse(readFileSync(inputs, 'utf8')) as Record<string, string>
    expect(Object.keys(recorded)).toContain('scripts/analyze.ts')
    expect(Object.keys(recorded)).toContain('shared/analysis/analyzeStrike.ts')
    expect(Object.keys(recorded).some(path => path.startsWith('node_modules/'))).toBe(false)
    const built = statSync(bundle).mtimeMs

    expect(launcher(dir, '--build', 'analyze').status).toBe(0)
    expect(statSync(bundle).mtimeMs).toBe(built)

    // A source that changed since the build (its recorded size and time no longer match).
    writeFileSync(inputs, JSON.stringify({ ...recorded, 'scripts/analyze.ts': '0:0' }))
    expect(launcher(dir, '--build', 'analyze').status).toBe(0)
    expect(statSync(bundle).mtimeMs).toBeGreaterThan(built)
    expect(JSON.parse(readFileSync(inputs, 'utf8'))['scripts/analyze.ts']).toBe(recorded['scripts/analyze.ts'])
  }, 240_000)

  it('rebuilds when a source it was made from was touched since, and prints the same JSON as the engine', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tw-cli-build-'))
    const bundle = join(dir, 'analyze', 'analyze.mjs')
    const file = 'tests/fixtures/audio/strike-48k-16bit.wav'
    const args = [file, '--note', 'A4', '--ratios', '1,2.7565', '--json']
    const before = npmAnalyze(dir, ...args)
    expect(before.stderr).toBe('')
    expect(before.status).toBe(0)
    const built = statSync(bundle).mtimeMs
    const direct = await analyzeStrike(new Uint8Array(readFileSync(join(root, file))), { note: 'A4', ratios: [1, 2.7565] })
    expect(before.stdout).toBe(`${JSON.stringify(direct, null, 2)}\n`)

    // A real source of the engine as if touched since the build: its recorded time no longer
    // matches. Touching the file itself would make every other test's bundle stale at once.
    const inputs = join(dir, 'analyze', 'inputs.json')
    const recorded = JSON.parse(readFileSync(inputs, 'utf8')) as Record<string, string>
    const [size, mtimeMs] = recorded['shared/analysis/analyzeStrike.ts']!.split(':')
    writeFileSync(inputs, JSON.stringify({ ...recorded, 'shared/analysis/analyzeStrike.ts': `${size}:${Number(mtimeMs) - 5_000}` }))
    const after = npmAnalyze(dir, ...args)
    expect(after.status).toBe(0)
    expect(statSync(bundle).mtimeMs).toBeGreaterThan(built)
    expect(after.stdout).toBe(before.stdout)
    expect(JSON.parse(readFileSync(inputs, 'utf8'))['shared/analysis/analyzeStrike.ts']).toBe(recorded['shared/analysis/analyzeStrike.ts'])
  }, 240_000)

  it('refuses a script it does not know with its usage line', () => {
    const run = launcher(mkdtempSync(join(tmpdir(), 'tw-cli-build-')), 'no-such-script')
    expect(run.status).toBe(2)
    expect(run.stderr).toMatch(/^Usage: node scripts\/run-built\.mjs/)
  })
})
