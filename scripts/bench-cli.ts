// Whole-process time of the command-line analysis (npm run bench:cli [-- --runs 10]).
// Runs `npm run analyze -- FILE --target-hz F --ratios R --json` on 4 s of a real strike
// (the tubular-bells-c5 fixture) and, to show where the time goes, the same call without npm
// (package.json's command line), the same without its Node flags, and an empty Node for the floor.
// The calls take turns, so a change in the machine's load hits them alike. CPU is user +
// system time of the process and everything it started (bash's `times`): on a shared machine
// it tells slow code from a busy machine; wall time is printed beside it. Goal ≤ 0.3 s.
import { execFileSync, spawnSync } from 'node:child_process'
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import os from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import { decodeAudio, encodeWav } from '../shared/analysis/index'
import { realFixturePath, realFixtures } from '../tests/support/realFixtures'

const ROOT = fileURLToPath(new URL('..', import.meta.url))
const GOAL_S = 0.3

function option(name: string, fallback: number): number {
  const at = process.argv.indexOf(name)
  const value = at < 0 ? fallback : Number(process.argv[at + 1])
  if (!Number.isInteger(value) || value < 1) throw new Error(`${name} takes a whole number of at least 1.`)
  return value
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b)
  return s.length % 2 ? s[s.length >> 1]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2
}

/** Seconds from bash's `times` line "0m1.230s 0m0.040s" (children's user and system time). */
function secondsOf(text: string): number {
  return [...text.matchAll(/(\d+)m([\d.]+)s/g)].reduce((sum, m) => sum + 60 * Number(m[1]) + Number(m[2]), 0)
}

/** One call's wall and CPU seconds; its output is checked, not printed. */
function measure(argv: string[], expectJson: boolean): { wallS: number, cpuS: number } {
  const started = process.hrtime.bigint()
  const run = spawnSync('bash', ['-c', '"$@" > "$TW_BENCH_OUT" 2>&1; status=$?; times; exit $status', 'bench', ...argv], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, TW_BENCH_OUT: OUT },
  })
  const wallS = Number(process.hrtime.bigint() - started) / 1e9
  if (run.status !== 0) throw new Error(`${argv.join(' ')} failed (${run.status}): ${readFileSync(OUT, 'utf8').slice(0, 400)}`)
  if (expectJson) JSON.parse(readFileSync(OUT, 'utf8'))
  const children = run.stdout.trim().split('\n').at(-1)!
  return { wallS, cpuS: secondsOf(children) }
}

const DIR = mkdtempSync(join(os.tmpdir(), 'tw-bench-cli-'))
const OUT = join(DIR, 'out.txt')

async function main() {
  const runs = option('--runs', 10)
  const fixture = realFixtures().find(f => f.id === 'tubular-bells-c5')!
  const decoded = await decodeAudio(new Uint8Array(readFileSync(realFixturePath(fixture))))
  const rate = decoded.sampleRate
  const file = join(DIR, 'strike-4s.wav')
  writeFileSync(file, encodeWav(decoded.channelData[0]!.subarray(0, 4 * rate), rate))
  const args = [file, '--target-hz', String(fixture.targetHz), '--ratios', fixture.ratios.join(','), '--json']

  execFileSync(process.execPath, ['scripts/run-built.mjs', '--build', 'analyze'], { cwd: ROOT, stdio: 'inherit' })
  const launcher = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')).scripts.analyze as string
  const cases = [
    { name: 'npm run analyze', argv: ['npm', 'run', '--silent', 'analyze', '--', ...args], json: true },
    { name: launcher, argv: [...launcher.split(' '), ...args], json: true },
    // What the Node flags in package.json are worth.
    { name: 'node scripts/run-built.mjs analyze (no flags)', argv: [process.execPath, 'scripts/run-built.mjs', 'analyze', ...args], json: true },
    { name: 'node -e 0 (Node alone)', argv: [process.execPath, '-e', '0'], json: false },
  ]
  const times = cases.map(() => ({ wall: [] as number[], cpu: [] as number[] }))
  const loadBefore = os.loadavg()[0]!
  for (let i = 0; i < runs; i++) {
    cases.forEach((c, k) => {
      const t = measure(c.argv, c.json)
      times[k]!.wall.push(t.wallS)
      times[k]!.cpu.push(t.cpuS)
    })
  }
  console.log(`Whole-process time of the CLI on 4 s of a real strike (${fixture.id}, ${rate} Hz), ${runs} runs each, taking turns; goal ≤ ${GOAL_S} s:`)
  cases.forEach((c, k) => {
    const { wall, cpu } = times[k]!
    console.log(
      `  ${c.name.padEnd(64)} CPU median ${median(cpu).toFixed(3)} s  min ${Math.min(...cpu).toFixed(3)} s   `
      + `wall median ${median(wall).toFixed(3)} s  min ${Math.min(...wall).toFixed(3)} s`,
    )
  })
  console.log(`  (load average ${loadBefore.toFixed(1)} before, ${os.loadavg()[0]!.toFixed(1)} after, ${os.cpus().length} cores)`)
}

await main()
