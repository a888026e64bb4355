/**
 * The mail the local catcher caught, read in the terminal (a production start has
 * no Mailbox screen):
 *
 *   npm run mailbox                      list messages, newest first (1 = newest)
 *   npm run mailbox -- show N|ID         print one message
 *   npm run mailbox -- save N|ID DIR     save its attachments into DIR
 *
 * The folder is `.data/mail` (`npm start`'s catcher) unless `--dir` or
 * TONEWRIGHT_MAIL_DIR says otherwise.
 */
import { copyFile, mkdir } from 'node:fs/promises'
import { join, resolve } from 'node:path'
import { parseArgs } from 'node:util'
import { listCaughtMail, type CaughtMessage } from '../server/utils/mailbox'

const { values, positionals } = parseArgs({
  allowPositionals: true,
  options: { dir: { type: 'string', default: process.env.TONEWRIGHT_MAIL_DIR ?? '.data/mail' }, limit: { type: 'string', default: '50' } },
})
const dir = resolve(values.dir!)
const [command = 'list', which, target] = positionals

function stop(sentence: string): never {
  console.error(`mailbox: ${sentence}`)
  process.exit(2)
}

const when = (m: CaughtMessage) => m.receivedAt.slice(0, 19).replace('T', ' ')

function pick(messages: CaughtMessage[], key: string | undefined): CaughtMessage {
  if (!key) stop('say which message: its number from the list (1 = newest) or its id.')
  const n = Number(key)
  const found = Number.isInteger(n) && n >= 1 ? messages[n - 1] : messages.find(m => m.id === key)
  return found ?? stop(`there is no message ${key} in ${dir} (${messages.length} caught).`)
}

const messages = await listCaughtMail(dir, command === 'list' ? Math.max(1, Number(values.limit) || 50) : 10_000)
if (command === 'list') {
  if (!messages.length) console.log(`No mail caught yet in ${dir}.`)
  for (const [i, m] of messages.entries()) {
    const files = m.attachments.length ? `  [${m.attachments.length} attachment${m.attachments.length > 1 ? 's' : ''}]` : ''
    console.log(`${String(i + 1).padStart(3)}  ${when(m)}  to ${m.to.join(', ')}\n     ${m.subject || '(no subject)'}${files}`)
  }
  if (messages.length) console.log('\nShow one with `npm run mailbox -- show N`; save its attachments with `npm run mailbox -- save N DIR`.')
}
else if (command === 'show') {
  const m = pick(messages, which)
  console.log(`Id:       ${m.id}\nReceived: ${when(m)} UTC\nFrom:     ${m.from}\nTo:       ${m.to.join(', ')}\nSubject:  ${m.subject}`)
  for (const a of m.attachments) console.log(`Attached: ${a.filename} (${a.contentType}, ${Math.ceil(a.size / 1024)} kB)`)
  console.log(`\n${m.text}`)
}
else if (command === 'save') {
  const m = pick(messages, which)
  if (!target) stop('say where to save the attachments: npm run mailbox -- save N DIR')
  if (!m.attachments.length) stop(`message ${which} has no attachments.`)
  await mkdir(target, { recursive: true })
  for (const a of m.attachments) {
    const to = join(target, a.filename)
    await copyFile(join(dir, a.file), to)
    console.log(`saved ${to}`)
  }
}
else {
  stop(`unknown command "${command}"; use list, show N or save N DIR.`)
}
