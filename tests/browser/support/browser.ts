import { mkdtempSync, mkdirSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'

export const BASE_URL = process.env.TW_BASE_URL ?? 'http://127.0.0.1:3100'
export const ARTEFACTS = join(process.cwd(), 'test-results', 'screenshots')

/** Debian's Chromium, headless, with a fresh profile each launch. */
export async function launch(extraArgs: string[] = []): Promise<{ browser: BrowserContext, close: () => Promise<void> }> {
  const profile = mkdtempSync(join(tmpdir(), 'tonewright-chromium-'))
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: [
      '--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update',
      '--disable-sync', '--no-first-run', '--disable-quic', ...extraArgs,
    ],
  })
  return {
    browser: context,
    close: async () => {
      await context.close()
      rmSync(profile, { recursive: true, force: true })
    },
  }
}

export type { Browser, Page }

export async function screenshot(page: Page, name: string) {
  mkdirSync(ARTEFACTS, { recursive: true })
  await page.screenshot({ path: join(ARTEFACTS, `${name}.png`), fullPage: true })
}

export const DEMO_PASSWORD = 'tonewright-demo'

export async function signInAs(page: Page, email: string, password = DEMO_PASSWORD) {
  await page.goto(`${BASE_URL}/signin`)
  await page.getByLabel('E-mail').fill(email)
  await page.getByLabel('Password').fill(password)
  await page.getByRole('button', { name: 'Sign in' }).click()
  await page.waitForURL(url => !url.pathname.startsWith('/signin'), { timeout: 20_000 })
}
