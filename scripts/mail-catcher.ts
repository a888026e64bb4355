/**
 * The local SMTP catcher: an SMTP server on loopback that accepts every message
 * and stores it instead of delivering it. Each message becomes `<id>.eml` (the raw
 * message), `<id>.json` (parsed: from, to, subject, text, html, attachments) and
 * `<id>/<attachment>` files in the folder given.
 *
 *   npx tsx scripts/mail-catcher.ts --port 2525 --dir .data/mail
 *
 * Writes its process id to `<dir>/catcher.pid` so the scripts (and tests that
 * stop and restart it) can end exactly this process.
 */
import { mkdir, rename, rm, writeFile } from 'node:fs/promises'
import { randomUUID } from 'node:crypto'
import { join, resolve } from 'node:path'
import { parseArgs } from 'node:util'
import { SMTPServer } from 'smtp-server'
import { simpleParser, type AddressObject } from 'mailparser'

const { values } = parseArgs({
  options: { port: { type: 'string', default: process.env.SMTP_PORT ?? '2525' }, dir: { type: 'string', default: '.data/mail' } },
})
const port = Number(values.port)
const dir = resolve(values.dir!)
if (!Number.isInteger(port) || port < 1 || port > 65535) {
  console.error(`mail-catcher: --port must be a port number, not "${values.port}".`)
  process.exit(2)
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = Array.isArray(value) ? value : value ? [value] : []
  return list.flatMap(a => a.value.map(v => v.address ?? '')).filter(Boolean)
}

/** A file name that stays inside the message's folder. */
function safeName(name: string, index: number) {
  const cleaned = name.replace(/[^\w.-]+/g, '_').replace(/^\.+/, '')
  return cleaned || `attachment-${index + 1}`
}

async function store(raw: Buffer, envelopeTo: string[]) {
  const parsed = await simpleParser(raw)
  const receivedAt = new Date()
  // Sortable by time, unique by the random tail.
  const id = `${receivedAt.toISOString().replace(/[:.]/g, '-')}-${randomUUID().slice(0, 8)}`
  await writeFile(join(dir, `${id}.eml`), raw)
  const attachments = []
  if (parsed.attachments.length) await mkdir(join(dir, id), { recursive: true })
  for (const [i, a] of parsed.attachments.entries()) {
    const filename = safeName(a.filename ?? '', i)
    await writeFile(join(dir, id, filename), a.content)
    attachments.push({ filename, contentType: a.contentType, size: a.size, file: `${id}/${filename}` })
  }
  const record = {
    id,
    receivedAt: receivedAt.toISOString(),
    messageId: parsed.messageId ?? null,
    from: addresses(parsed.from)[0] ?? '',
    to: addresses(parsed.to),
    envelopeTo,
    subject: parsed.subject ?? '',
    text: parsed.text ?? '',
    html: typeof parsed.html === 'string' ? parsed.html : '',
    attachments,
  }
  // The JSON is written last: a reader that sees it sees a complete message.
  await writeFile(join(dir, `${id}.json.tmp`), JSON.stringify(record, null, 2))
  await rename(join(dir, `${id}.json.tmp`), join(dir, `${id}.json`))
  console.log(`mail-catcher: stored "${record.subject}" for ${record.to.join(', ')} (${attachments.length} attachment(s))`)
}

const server = new SMTPServer({
  authOptional: true,
  disabledCommands: ['STARTTLS'],
  banner: 'Tonewright local mail catcher',
  size: 25 * 1024 * 1024,
  onAuth(_auth, _session, callback) {
    callback(null, { user: 'local' })
  },
  onData(stream, session, callback) {
    const chunks: Buffer[] = []
    stream.on('data', (chunk: Buffer) => chunks.push(chunk))
    stream.on('end', () => {
      const to = session.envelope.rcptTo.map(r => r.address)
      store(Buffer.concat(chunks), to).then(() => callback(), (error: Error) => callback(error))
    })
  },
})

server.on('error', (error) => {
  console.error(`mail-catcher: ${error.message}`)
})

const pidFile = join(dir, 'catcher.pid')

async function stop() {
  server.close(async () => {
    await rm(pidFile, { force: true })
    process.exit(0)
  })
  // Open connections would hold close() forever.
  setTimeout(() => process.exit(0), 2000).unref()
}

await mkdir(dir, { recursive: true })
server.listen(port, '127.0.0.1', async () => {
  await writeFile(pidFile, String(process.pid))
  console.log(`mail-catcher: listening on 127.0.0.1:${port}, storing messages in ${dir}`)
})
process.on('SIGTERM', stop)
process.on('SIGINT', stop)
