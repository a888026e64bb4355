import { describe, expect, it } from 'vitest'
import { BASE_URL, screenshot, signInAs, useBrowser } from '../../support/browser'
import { ROLES } from '../../support/screens'

// Two screens full of looks (stage swatches, verdict marks, statuses) at a landscape and a
// portrait size, kept as artefacts so a change of the meaning map can be seen before and after.
// TW_SHOT_TAG names the run (e.g. "before"); the default is "looks".
const TAG = process.env.TW_SHOT_TAG ?? 'looks'
const SIZES = [{ width: 1280, height: 800 }, { width: 800, height: 1280 }] as const

const { newPage } = useBrowser()

describe('looks at two sizes', () => {
  it('draws the demo marimba set and the review queue with their marks, landscape and portrait', async () => {
    const page = await newPage()
    await signInAs(page, ROLES.supervisor.email)
    await page.goto(`${BASE_URL}/sets`)
    await page.getByRole('link', { name: /Concert marimba/ }).first().click()
    await page.waitForURL(/\/sets\/[0-9a-f-]{36}$/)
    const setUrl = page.url()
    for (const size of SIZES) {
      await page.setViewportSize(size)
      await page.goto(setUrl)
      await page.getByRole('heading', { level: 1, name: /Concert marimba/ }).waitFor()
      await screenshot(page, `${TAG}-set-${size.width}x${size.height}`)
      await page.goto(`${BASE_URL}/review`)
      await page.getByRole('heading', { level: 1, name: 'Review', exact: true }).waitFor()
      await screenshot(page, `${TAG}-review-${size.width}x${size.height}`)
    }
    expect(page.viewportSize()).toEqual(SIZES[1])
  })
})
