import { randomUUID } from 'node:crypto'
import { afterAll, describe, expect, it } from 'vitest'
import { bodyPolicy } from '../../../server/utils/request-limits'
import { BASE_URL, api, newWorkshop } from '../support/http'
import { allRoutes } from './routes'
import { testSql } from '../support/mail'

// Class guarded: "A malformed request gets a plain sentence and a 4xx, never a 500 or a stack trace",
// on every route the server has, not only on the ones a test was written for.

afterAll(async () => {
  await testSql().end()
})

/** Ends the session the walk runs on; its own tests cover it. */
const SKIPPED = new Set(['POST /api/auth/logout'])

/** Path parameters no record has: a well-formed id of nothing, and shapes no id has. */
const IDS = [randomUUID(), 'not-an-id', '0', 'x'.repeat(400), '%2e%2e%2f%2e%2e%2fetc', `1'%20or%20'1'='1`, '%ff%fe']

function nested(depth: number): string {
  return '{"a":'.repeat(depth) + '1' + '}'.repeat(depth)
}

/** JSON bodies of the wrong shape, and text that is not JSON at all. */
const JSON_BODIES: (string | undefined)[] = [
  undefined, '', '{}', '[]', '"text"', 'null', '12', '{"a":', '\u0000\u0001',
  '{"id":{"$ne":null},"name":["x"],"stage":12,"partials":"x","email":1e309,"lengthMm":-1,"token":{}}',
  nested(2000),
]

/** Query strings of the wrong shape for any list. */
const QUERIES = ['', '?page=-1&limit=99999999999&sort=%27&q=%ff&set=..&group=x&status[]=1&benchmaker=0&inline=2']

function uploadBodies(): FormData[] {
  const garbage = new FormData()
  garbage.append('file', new Blob([new Uint8Array(200).fill(7)], { type: 'audio/wav' }), 'strike.wav')
  garbage.append('referenceHz', 'loud')
  garbage.append('calibration-id', 'nope')
  const twice = new FormData()
  twice.append('file', new Blob([new Uint8Array(10)]), 'a.wav')
  twice.append('file', new Blob([new Uint8Array(10)]), 'b.wav')
  return [new FormData(), garbage, twice]
}

interface Attempt { route: string, url: string, body: string }

async function attempt(method: string, url: string, token: string, body: string | FormData | undefined, type?: string) {
  const headers: Record<string, string> = { accept: 'application/json', authorization: `Bearer ${token}` }
  if (type) headers['content-type'] = type
  const response = await fetch(`${BASE_URL}${url}`, { method, headers, body: method === 'GET' ? undefined : body })
  return { status: response.status, text: await response.text() }
}

function attemptsFor(route: string): { method: string, url: string, body: string | FormData | undefined, type?: string }[] {
  const [method, path] = route.split(' ') as [string, string]
  const urls = /:\w+/.test(path) ? IDS.map(id => path.replace(/:\w+/g, id)) : QUERIES.map(q => path + q)
  return urls.flatMap((url) => {
    if (method === 'GET' || method === 'DELETE') return [{ method, url, body: undefined }]
    if (bodyPolicy(method, url.split('?')[0]!).kind === 'upload') {
      return [...uploadBodies().map(body => ({ method, url, body })), { method, url, body: '--x\r\n\r\n--x--', type: 'multipart/form-data; boundary=y' }]
    }
    return [...JSON_BODIES.map(body => ({ method, url, body, type: 'application/json' })), { method, url, body: 'a=1', type: 'text/plain' }]
  })
}

describe('web: every route answers malformed requests with a 4xx and a plain sentence', () => {
  it('never answers 500, never shows a stack trace, and keeps the session usable', { timeout: 600_000 }, async () => {
    const owner = await newWorkshop('Route walk workshop')
    const routes = allRoutes().filter(r => !SKIPPED.has(r))
    expect(routes.length).toBeGreaterThan(60)
    const failures: string[] = []
    const statuses = new Map<number, number>()
    for (const route of routes) {
      for (const a of attemptsFor(route)) {
        const reply = await attempt(a.method, a.url, owner.token, a.body, a.type)
        statuses.set(reply.status, (statuses.get(reply.status) ?? 0) + 1)
        const where: Attempt = { route, url: a.url.slice(0, 80), body: typeof a.body === 'string' ? a.body.slice(0, 40) : a.body ? 'form' : '' }
        if (reply.status >= 500) failures.push(`${JSON.stringify(where)} → ${reply.status} ${reply.text.slice(0, 160)}`)
        else if (/\bat \S+ \(|node_modules|\.ts:\d+|Error: /.test(reply.text)) failures.push(`${JSON.stringify(where)} → stack: ${reply.text.slice(0, 160)}`)
        else if (reply.status >= 400 && reply.status !== 404 && /^\s*\{/.test(reply.text)) {
          const message = (JSON.parse(reply.text) as { message?: unknown }).message
          if (typeof message !== 'string' || message.length < 8) failures.push(`${JSON.stringify(where)} → ${reply.status} without a sentence: ${reply.text.slice(0, 120)}`)
        }
      }
    }
    expect(failures).toEqual([])
    // A control: the walk reached the handlers (not only the sign-in check), and the session still works.
    expect((statuses.get(400) ?? 0) + (statuses.get(404) ?? 0) + (statuses.get(415) ?? 0)).toBeGreaterThan(200)
    expect((await api('/api/sets', { token: owner.token })).status).toBe(200)
  })
})
