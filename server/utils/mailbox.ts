import { readdir, readFile } from 'node:fs/promises'
import { join, resolve, sep } from 'node:path'
import { fail } from './http-errors'

export interface CaughtMessage {
  id: string
  receivedAt: string
  from: string
  to: string[]
  subject: string
  text: string
  html: string
  attachments: { filename: string, contentType: string, size: number, file: string }[]
}

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
  const messages = await Promise.all(files.map(async (n) => {
    try {
      return JSON.parse(await readFile(join(dir, n), 'utf8')) as CaughtMessage
    }
    catch {
      return null
    }
  }))
  return messages.filter((m): m is CaughtMessage => m !== null)
}

/** One attachment's bytes, kept inside the catcher's folder. */
export async function caughtAttachment(dir: string, id: string, file: string) {
  const base = resolve(dir)
  const path = resolve(base, id, file)
  if (!path.startsWith(base + sep)) fail(404, 'No such attachment.')
  try {
    return await readFile(path)
  }
  catch {
    fail(404, 'No such attachment.')
  }
}

export function requireDevMailbox() {
  if (!useRuntimeConfig().public.devMailbox) fail(404, 'The mailbox exists only in development.')
  return String(useRuntimeConfig().mailCatcherDir)
}
