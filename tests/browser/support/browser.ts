import { mkdirSync } from 'node:fs'
import { join } from 'node:path'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'
import { afterAll, beforeAll } from 'vitest'

export const BASE_URL = process.env.TW_BASE_URL ?? 'http://127.0.0.1:3100'
export const ARTEFACTS = join(process.cwd(), 'test-results', 'screenshots')

/**
 * Debian's Chromium, headless. Playwright gives every launch a fresh, temporary
 * profile (--user-data-dir); each test opens its own context (own cookies).
 */
export async function launch(extraArgs: string[] = []): Promise<{ browser: Browser, newPage: () => Promise<Page>, close: () => Promise<void> }> {
  const browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--disable-sync', '--no-first-run', '--disable-quic', ...extraArgs,
    ],
  })
  const contexts: BrowserContext[] = []
  // Anything the Content-Security-Policy blocked: the app must work within its own policy.
  const cspViolations: string[] = []
  return {
    browser,
    newPage: async () => {
      const context = await browser.newContext({ viewport: { width: 1280, height: 800 } })
      contexts.push(context)
      const page = await context.newPage()
      page.on('console', (message) => {
        if (/Content Security Policy/i.test(message.text())) cspViolations.push(`${page.url()}: ${message.text()}`)
      })
      return page
    },
    close: async () => {
      for (const c of contexts) await c.close().catch(() => {})
      await browser.close()
      if (cspViolations.length) throw new Error(`The Content-Security-Policy blocked:\n${[...new Set(cspViolations)].join('\n')}`)
    },
  }
}

export type { Browser, Page }

export async function screenshot(page: Page, name: string) {
  mkdirSync(ARTEFACTS, { recursive: true })
  await page.screenshot({ path: join(ARTEFACTS, `${name}.png`), fullPage: true })
}

export const DEMO_PASSWORD = 'tonewright-demo'

/**
 * Waits until Nuxt has hydrated the page: the server draws it first, and on a loaded machine a
 * click or a typed value that lands before the page runs in the browser is lost.
 */
export async function untilHydrated(page: Page, timeout = 60_000) {
  await page.waitForFunction(() => {
    type Root = { __vue_app__?: { config: { globalProperties: { $nuxt?: { isHydrating?: boolean } } } } }
    const app = (document.querySelector('#__nuxt') as Root | null)?.__vue_app__
    // A page that is not the app (a PDF, a JSON answer) has nothing to hydrate.
    if (!document.querySelector('#__nuxt')) return true
    return app?.config.globalProperties.$nuxt?.isHydrating === false
  }, undefined, { timeout })
}

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${BASE_URL}/signin`)
  await untilHydrated(page)
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => !url.pathname.startsWith('/signin'), { timeout: 20_000 })
}

/** One browser for a test file: launched before its tests, closed after them. */
export function useBrowser(extraArgs: string[] = []): { newPage: () => Promise<Page> } {
  let session: Awaited<ReturnType<typeof launch>> | undefined
  beforeAll(async () => {
    session = await launch(extraArgs)
  })
  afterAll(async () => {
    await session?.close()
  })
  return {
    // Every navigation waits for the app to hydrate: a click or a keystroke before then lands on the
    // server-drawn page and is lost (on a loaded machine that took over 30 s to show).
    newPage: async () => {
      const page = await session!.newPage()
      const goto = page.goto.bind(page)
      page.goto = async (...args: Parameters<Page['goto']>) => {
        const response = await goto(...args)
        await untilHydrated(page)
        return response
      }
      return page
    },
  }
}
