import { readdir, readFile } from 'node:fs/promises'
import { join, resolve, sep } from 'node:path'
import { and, eq, inArray } from 'drizzle-orm'
import { mailMessages } from '../database/schema'
import type { Executor } from '../database/client'

export interface CaughtMessage {
  id: string
  receivedAt: string
  messageId?: string | null
  from: string
  to: string[]
  subject: string
  text: string
  html: string
  attachments: { filename: string, contentType: string, size: number, file: string }[]
}

const CAUGHT_ID = /^[\w-]{10,80}$/

/** Messages stored by the local SMTP catcher (scripts/mail-catcher.ts), newest first. */
export async function listCaughtMail(dir: string, limit = 200): Promise<CaughtMessage[]> {
  let names: string[]
  try {
    names = await readdir(dir)
  }
  catch {
    return []
  }
  const files = names.filter(n => n.endsWith('.json')).sort().reverse().slice(0, limit)
  const messages = await Promise.all(files.map(n => readCaught(dir, n.slice(0, -'.json'.length))))
  return messages.filter((m): m is CaughtMessage => m !== null)
}

/** One caught message by its id (the catcher's file name), or null. */
export async function readCaught(dir: string, id: string): Promise<CaughtMessage | null> {
  if (!CAUGHT_ID.test(id)) return null
  try {
    return JSON.parse(await readFile(join(dir, `${id}.json`), 'utf8')) as CaughtMessage
  }
  catch {
    return null
  }
}

/** The outbox row id in a Message-ID the mail worker set (`<row id@tonewright.mail>`). */
export function outboxIdOf(message: Pick<CaughtMessage, 'messageId'>): string | null {
  const match = /^<([0-9a-f-]{36})@tonewright\.mail>$/i.exec(message.messageId ?? '')
  return match ? match[1]!.toLowerCase() : null
}

/**
 * Only the caught messages that this workshop's outbox sent: mail of other
 * workshops and mail that belongs to no workshop (password resets) stays out.
 */
export async function workshopCaughtMail(db: Executor, dir: string, workshopId: string, limit = 200): Promise<CaughtMessage[]> {
  const caught = await listCaughtMail(dir, limit)
  const ids = [...new Set(caught.map(outboxIdOf).filter((id): id is string => id !== null))]
  if (!ids.length) return []
  const rows = await db.select({ id: mailMessages.id }).from(mailMessages)
    .where(and(eq(mailMessages.workshopId, workshopId), inArray(mailMessages.id, ids)))
  const own = new Set(rows.map(r => r.id))
  return caught.filter((m) => {
    const id = outboxIdOf(m)
    return id !== null && own.has(id)
  })
}

/** One attachment's bytes of a message this workshop sent, kept inside the catcher's folder; null otherwise. */
export async function workshopCaughtAttachment(db: Executor, dir: string, workshopId: string, id: string, file: string) {
  const message = await readCaught(dir, id)
  const outboxId = message ? outboxIdOf(message) : null
  if (!message || !outboxId) return null
  const [row] = await db.select({ id: mailMessages.id }).from(mailMessages)
    .where(and(eq(mailMessages.workshopId, workshopId), eq(mailMessages.id, outboxId)))
  const attachment = message.attachments.find(a => a.filename === file)
  if (!row || !attachment) return null
  const base = resolve(dir)
  const path = resolve(base, attachment.file)
  if (!path.startsWith(base + sep)) return null
  try {
    return { bytes: await readFile(path), attachment }
  }
  catch {
    return null
  }
}
