import { readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'

/** The bytes of a recording under tests/fixtures/audio (made by scripts/make-test-audio.sh). */
export function audioFixture(name: string): Uint8Array {
  return new Uint8Array(readFileSync(fileURLToPath(new URL(`../fixtures/audio/${name}`, import.meta.url))))
}
