import { expect } from 'vitest'
import type { Locator } from 'playwright-core'

// What each role may open, from the role table in README.md (Roles and stages) (owner: everything;
// supervisor: review and sign-off plus bench rights; benchmaker: the bench; office:
// sets, buyers, certificates, read everything). The test server is a production
// build, so the development-only Mailbox is never among them.
export const ROLES = {
  owner: { email: 'owner@tonewright.test', nav: ['Bench', 'Pieces', 'Sets', 'Lots', 'Review', 'Templates', 'Certificates', 'Team', 'Settings'], forbidden: [] },
  supervisor: { email: 'supervisor@tonewright.test', nav: ['Bench', 'Pieces', 'Sets', 'Lots', 'Review', 'Templates', 'Certificates', 'Team'], forbidden: ['/settings'] },
  benchmaker: { email: 'bench@tonewright.test', nav: ['Bench', 'Pieces', 'Sets', 'Lots', 'Templates', 'Team'], forbidden: ['/review', '/certificates', '/settings'] },
  office: { email: 'office@tonewright.test', nav: ['Pieces', 'Sets', 'Lots', 'Templates', 'Certificates', 'Team'], forbidden: ['/bench', '/review', '/settings'] },
} as const

/** Waits for the first match and then for its text to match the pattern. */
export async function expectText(locator: Locator, pattern: RegExp) {
  await locator.first().waitFor()
  await expect.poll(() => locator.first().innerText()).toMatch(pattern)
}
