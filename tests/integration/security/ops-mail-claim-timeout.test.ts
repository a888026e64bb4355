// Class: nothing is half-saved or left dangling after a crash — a mail message
// claimed by a worker that died is picked up again after its lease, never stays
// claimed, and is delivered exactly once.
import { spawn, type ChildProcess } from 'node:child_process'
import { createServer, type Server, type Socket } from 'node:net'
import { afterAll, describe, expect, it } from 'vitest'
import { uniqueEmail } from '../support/http'
import { mailTo, testSql, until } from '../support/mail'

const LEASE_S = 6

/** An SMTP server that accepts connections and never says a word: a send to it hangs. */
function silentSmtp() {
  const sockets: Socket[] = []
  const server = createServer(socket => sockets.push(socket))
  return new Promise<{ server: Server, port: number, sockets: Socket[] }>((resolve) => {
    server.listen(0, '127.0.0.1', () => resolve({ server, port: (server.address() as { port: number }).port, sockets }))
  })
}

let child: ChildProcess | undefined
afterAll(async () => {
  child?.kill('SIGKILL')
  await testSql().end()
})

describe('mail claim timeout (class: nothing dangles after a crash)', () => {
  it('a worker killed mid-send leaves a claim that expires; another worker delivers the message exactly once', async () => {
    const address = uniqueEmail('lease')
    const smtp = await silentSmtp()
    child = spawn(process.execPath, ['--import', 'tsx', 'tests/integration/support/doomed-mail-worker.ts', address, String(smtp.port), String(LEASE_S)], { stdio: ['ignore', 'pipe', 'inherit'] })
    let out = ''
    child.stdout!.on('data', (chunk) => {
      out += String(chunk)
    })
    const id = await until('the doomed worker to queue its message', async () => /^([0-9a-f-]{36})\n/.exec(out)?.[1], 30_000)
    // It has claimed the message and is talking to the silent server when it dies.
    await until('the doomed worker to connect', async () => smtp.sockets.length > 0, 20_000)
    const [claimed] = await testSql()`select status, claimed_by, claimed_until, claimed_until > now() as holds from mail_messages where id = ${id}`
    expect(claimed!.status).toBe('queued')
    expect(claimed!.claimed_by).toMatch(/^doomed:/)
    expect(claimed!.holds).toBe(true)
    child.kill('SIGKILL')
    await new Promise(r => child!.once('exit', r))
    smtp.server.close()
    for (const s of smtp.sockets) s.destroy()
    expect(out).not.toContain('the send ended')
    expect(await mailTo(address)).toHaveLength(0)

    // After the lease the app's worker takes the message over and delivers it.
    const sent = await until('delivery after the lease', async () => {
      const [row] = await testSql()`select status, attempts, claimed_by, claimed_until, sent_at from mail_messages where id = ${id}`
      return row?.status === 'sent' ? row : null
    }, 60_000, 500)
    expect(sent.attempts).toBe(1)
    expect(sent.claimed_by).toBeNull()
    expect(sent.claimed_until).toBeNull()
    // Nobody took it over while the dead worker's lease still held.
    expect(new Date(sent.sent_at).getTime()).toBeGreaterThanOrEqual(new Date(claimed!.claimed_until).getTime())
    await until('the message in the catcher', async () => (await mailTo(address)).length > 0, 15_000)
    // A few sweeps later it is still there once: the old job and the new one did not both send.
    await new Promise(r => setTimeout(r, 5000))
    expect(await mailTo(address)).toHaveLength(1)
  })

  it('no queued message stays claimed past its lease', async () => {
    const [row] = await testSql()`select count(*)::int as n from mail_messages where status = 'queued' and claimed_until < now() - interval '30 seconds'`
    expect(row!.n).toBe(0)
  })
})
