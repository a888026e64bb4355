import { spawn } from 'node:child_process'
import { existsSync, openSync } from 'node:fs'
import { readdir, readFile } from 'node:fs/promises'
import { connect } from 'node:net'
import { join } from 'node:path'
import postgres from 'postgres'

export const MAIL_DIR = process.env.TW_MAIL_DIR ?? '.data/test-mail'
export const SMTP_PORT = Number(process.env.TW_SMTP_PORT ?? 2626)

export interface Caught {
  id: string
  to: string[]
  subject: string
  text: string
  html: string
  attachments: { filename: string, contentType: string, size: number, file: string }[]
}

/** Everything the local catcher stored so far. */
export async function caughtMail(): Promise<Caught[]> {
  const names = existsSync(MAIL_DIR) ? await readdir(MAIL_DIR) : []
  return Promise.all(names.filter(n => n.endsWith('.json')).sort().map(async n => JSON.parse(await readFile(join(MAIL_DIR, n), 'utf8')) as Caught))
}

export const mailTo = async (address: string) => (await caughtMail()).filter(m => m.to.includes(address))

export async function until<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 30_000, everyMs = 250): Promise<T> {
  const end = Date.now() + timeoutMs
  for (;;) {
    const value = await probe()
    if (value) return value
    if (Date.now() > end) throw new Error(`Timed out waiting for ${what}`)
    await new Promise(r => setTimeout(r, everyMs))
  }
}

/** Waits for the first message to an address and returns it. */
export async function waitForMailTo(address: string, timeoutMs = 30_000) {
  return until(`mail to ${address}`, async () => (await mailTo(address))[0], timeoutMs)
}

export function attachmentPath(message: Caught, index = 0) {
  return join(MAIL_DIR, message.attachments[index]!.file)
}

function portOpen(port: number) {
  return new Promise<boolean>((resolve) => {
    const socket = connect(port, '127.0.0.1')
    socket.once('connect', () => {
      socket.destroy()
      resolve(true)
    })
    socket.once('error', () => resolve(false))
  })
}

/** Stops the catcher started by scripts/test.sh (by the pid it wrote), and waits until the port is closed. */
export async function stopCatcher() {
  const pid = Number(await readFile(join(MAIL_DIR, 'catcher.pid'), 'utf8'))
  process.kill(pid, 'SIGTERM')
  await until('the catcher to stop', async () => !(await portOpen(SMTP_PORT)), 10_000)
}

/** Starts the catcher again, detached, so scripts/test.sh's clean-up ends it by its pid file. */
export async function startCatcher() {
  const log = openSync(join(MAIL_DIR, 'catcher.log'), 'a')
  const child = spawn(process.execPath, ['--import', 'tsx', 'scripts/mail-catcher.ts', '--port', String(SMTP_PORT), '--dir', MAIL_DIR], { detached: true, stdio: ['ignore', log, log] })
  child.unref()
  await until('the catcher to listen', () => portOpen(SMTP_PORT), 20_000)
}

let sql: ReturnType<typeof postgres> | undefined
/** Direct SQL on the test database, for what no API should do (tampering, moving clocks). */
export function testSql() {
  if (!sql) sql = postgres(process.env.NUXT_DATABASE_URL!, { max: 2, onnotice: () => {} })
  return sql
}
