import { spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, statSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'

const root = fileURLToPath(new URL('../../../', import.meta.url))

function launcher(dir: string, ...args: string[]) {
  return spawnSync(process.execPath, ['scripts/run-built.mjs', ...args], { cwd: root, encoding: 'utf8', timeout: 120_000, env: { ...process.env, TONEWRIGHT_CLI_DIR: dir } })
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

  it('refuses a script it does not know with its usage line', () => {
    const run = launcher(mkdtempSync(join(tmpdir(), 'tw-cli-build-')), 'no-such-script')
    expect(run.status).toBe(2)
    expect(run.stderr).toMatch(/^Usage: node scripts\/run-built\.mjs/)
  })
})
