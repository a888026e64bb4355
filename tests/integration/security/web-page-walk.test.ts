import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import { BASE_URL, newWorkshop } from '../support/http'

// Class guarded: "A page address of the wrong shape (an odd id, a token that is no token, characters
// no address has) is answered with a page that says so, never a 500 or a stack trace", for every page.

const PAGES_DIR = fileURLToPath(new URL('../../../app/pages', import.meta.url))

/** Every page file under app/pages, as its path with `[param]` kept. */
function allPages(dir = PAGES_DIR): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    if (statSync(path).isDirectory()) return allPages(path)
    if (!name.endsWith('.vue')) return []
    return [`/${relative(PAGES_DIR, path).replace(/\.vue$/, '').replace(/(^|\/)index$/, '')}`]
  })
}

const ODD = ['not-an-id', '%ff%fe', 'x'.repeat(600), '..%2f..%2fetc%2fpasswd', '%3Cscript%3Ealert(1)%3C%2Fscript%3E']
const QUERIES = ['', '?token=%ff&page=-1&set=..&q=%3Cb%3E']

async function fetchPage(path: string, cookie?: string) {
  const response = await fetch(`${BASE_URL}${path}`, { headers: { accept: 'text/html', ...(cookie ? { cookie } : {}) }, redirect: 'manual' })
  return { status: response.status, text: await response.text() }
}

describe('web: every page answers odd addresses without a 500', () => {
  it('signed out and signed in, with odd ids and queries', { timeout: 600_000 }, async () => {
    const pages = allPages()
    expect(pages.length).toBeGreaterThan(15)
    const owner = await newWorkshop('Page walk workshop')
    const cookie = `auth.token=${encodeURIComponent(owner.token)}`
    const failures: string[] = []
    for (const page of pages) {
      const paths = /\[\w+\]/.test(page) ? ODD.map(id => page.replace(/\[\w+\]/g, id)) : QUERIES.map(q => page + q)
      for (const path of paths) {
        for (const who of [undefined, cookie]) {
          const reply = await fetchPage(path, who)
          const where = `${who ? 'signed in' : 'signed out'} ${path.slice(0, 60)}`
          if (reply.status >= 500) failures.push(`${where} → ${reply.status}`)
          else if (/\bat \S+ \(|node_modules\/|\.ts:\d+:\d+|<script>alert\(1\)/.test(reply.text)) failures.push(`${where} → stack or echoed markup`)
        }
      }
    }
    expect(failures).toEqual([])
  })
})

// Class guarded: "A form submitted before the app has started in the browser (a slow connection, a
// quick Enter) never puts what was typed — a password among it — into an address, where server logs,
// history and proxies keep it": every server-drawn form posts, except search bars (role="search").
describe('web: server-drawn forms post', () => {
  it('every form on every page, signed out and in, has method="post"', { timeout: 300_000 }, async () => {
    const owner = await newWorkshop('Form walk workshop')
    const cookie = `auth.token=${encodeURIComponent(owner.token)}`
    const failures: string[] = []
    let forms = 0
    for (const page of allPages().filter(p => !/\[\w+\]/.test(p))) {
      for (const who of [undefined, cookie]) {
        const reply = await fetchPage(page, who)
        for (const tag of reply.text.match(/<form\b[^>]*>/g) ?? []) {
          forms++
          if (!/\bmethod="post"/.test(tag) && !/\brole="search"/.test(tag)) failures.push(`${who ? 'signed in' : 'signed out'} ${page}: ${tag.slice(0, 80)}`)
        }
      }
    }
    expect(forms).toBeGreaterThan(5)
    expect(failures).toEqual([])
    // And the signed-out pages' buttons wait for the page to start: nothing typed is lost to a plain post.
    for (const page of ['/signin', '/signup', '/forgot-password']) {
      const submit = (await fetchPage(page)).text.match(/<button\b[^>]*type="submit"[^>]*>/)?.[0] ?? ''
      expect(submit, page).toMatch(/\bdisabled\b/)
    }
  })

  it('a sign-in form posted before the app started is answered with the page, not an error, and echoes nothing', async () => {
    const secret = 'Pre-hydration-secret-42'
    const response = await fetch(`${BASE_URL}/signin`, {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', 'accept': 'text/html' },
      body: new URLSearchParams({ email: 'someone@example.test', password: secret }).toString(),
      redirect: 'manual',
    })
    const text = await response.text()
    expect(response.status).toBeLessThan(500)
    expect(response.headers.get('location') ?? '').not.toContain(secret)
    expect(text).not.toContain(secret)
  })
})
