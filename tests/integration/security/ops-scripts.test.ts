// Class: operations — a killed `npm start` leaves nothing that blocks the next one
// (pids recorded in .data and checked before anything is stopped), two starts cannot
// set up at once (a lock file in .data), and `npm test` serves its own build.
import { execFile, spawn } from 'node:child_process'
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { promisify } from 'node:util'
import { describe, expect, it } from 'vitest'
import { until } from '../support/mail'

const run = promisify(execFile)
const ROOT = process.cwd()
const dir = mkdtempSync(join(tmpdir(), 'tonewright-ops-'))

/** Runs bash with scripts/lib.sh loaded. */
function lib(script: string) {
  return run('bash', ['-c', `source scripts/lib.sh; ${script}`], { cwd: ROOT, encoding: 'utf8' })
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0)
    return true
  }
  catch {
    return false
  }
}

describe('start script operations (class: operations)', () => {
  it('two holders of the start lock never overlap; the second says that it waits', async () => {
    const lock = join(dir, 'start.lock')
    const log = join(dir, 'lock.log')
    const holder = (name: string) => lib(`take_lock ${lock} "${name} waits for the lock"; echo "${name} in $(date +%s%N)" >>${log}; sleep 1; echo "${name} out $(date +%s%N)" >>${log}`)
    const [a, b] = await Promise.all([holder('A'), holder('B')])
    const lines = readFileSync(log, 'utf8').trim().split('\n').map(l => l.split(' '))
    expect(lines.map(l => l[1])).toEqual(['in', 'out', 'in', 'out'])
    expect(lines[0]![0]).toBe(lines[1]![0])
    expect(BigInt(lines[2]![2]!)).toBeGreaterThanOrEqual(BigInt(lines[1]![2]!))
    expect(`${a.stdout}${b.stdout}`).toMatch(/[AB] waits for the lock/)
  })

  it('a holder killed with kill -9 leaves the lock free, even when a child it started lives on', async () => {
    const lock = join(dir, 'killed.lock')
    const childPidFile = join(dir, 'child.pid')
    const holder = spawn('bash', ['-c', `source scripts/lib.sh; take_lock ${lock} waiting; (exec sleep 60 9>&-) & echo $! >${childPidFile}; echo held; sleep 60`], { cwd: ROOT, stdio: ['ignore', 'pipe', 'inherit'] })
    await new Promise<void>(resolve => holder.stdout!.on('data', chunk => String(chunk).includes('held') && resolve()))
    const child = Number(readFileSync(childPidFile, 'utf8'))
    holder.kill('SIGKILL')
    await new Promise(r => holder.once('exit', r))
    try {
      expect(alive(child)).toBe(true)
      const started = Date.now()
      const next = await lib(`take_lock ${lock} "still blocked"; echo got it`)
      expect(next.stdout).toContain('got it')
      expect(next.stdout).not.toContain('still blocked')
      expect(Date.now() - started).toBeLessThan(10_000)
    }
    finally {
      process.kill(child, 'SIGKILL')
    }
  })

  it('an app left running by a killed start is found by its recorded pid and stopped', async () => {
    const orphan = spawn(process.execPath, ['-e', 'setInterval(() => {}, 1000)', join(dir, 'output/server/index.mjs')], { cwd: ROOT, stdio: 'ignore', detached: true })
    const pidFile = join(dir, 'app.pid')
    writeFileSync(pidFile, String(orphan.pid))
    const found = await lib(`recorded_pid ${pidFile} /server/index.mjs`)
    expect(found.stdout.trim()).toBe(String(orphan.pid))
    await lib(`stop_recorded ${pidFile} /server/index.mjs`)
    await until('the orphan to end', async () => !alive(orphan.pid!), 15_000)
    await expect(lib(`test -e ${pidFile}`)).rejects.toThrow()
  })

  it('a recorded pid that now belongs to another program is never stopped', async () => {
    const stranger = spawn('sleep', ['60'], { cwd: ROOT, stdio: 'ignore' })
    const pidFile = join(dir, 'reused.pid')
    writeFileSync(pidFile, String(stranger.pid))
    try {
      await expect(lib(`recorded_pid ${pidFile} /server/index.mjs`)).rejects.toThrow()
      await lib(`stop_recorded ${pidFile} /server/index.mjs`)
      expect(alive(stranger.pid!)).toBe(true)
    }
    finally {
      stranger.kill('SIGKILL')
    }
  })

  it('npm test serves its own build, not the .output folder that npm start serves', async () => {
    const pid = readFileSync(join(ROOT, '.data/test-app.pid'), 'utf8').trim()
    const cmdline = readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0').join(' ')
    expect(cmdline).toContain(join(ROOT, '.data/test-output/server/index.mjs'))
    expect(cmdline).not.toContain('/.output/')
    // The PDF worker is built beside that server and does not load the server itself (which would listen a second time).
    const worker = readFileSync(join(ROOT, '.data/test-output/server/workers/certificate-pdf.mjs'), 'utf8')
    expect(worker).toMatch(/export \{ render as default \}/)
    expect(worker).not.toMatch(/chunks\/nitro\//)
  })
})
