import { existsSync } from 'node:fs'
import { dirname, join } from 'node:path'
import { fileURLToPath } from 'node:url'

/**
 * A worker entry built beside the server (`<output>/server/workers/<name>.mjs`, see
 * server/workers/entries.ts), looked up from this chunk's folder upwards; null where
 * there is no build (scripts, `nuxt dev`, vitest).
 */
export function builtWorkerFile(name: string): string | null {
  let dir = dirname(fileURLToPath(import.meta.url))
  for (let i = 0; i < 4; i++) {
    const file = join(dir, 'workers', `${name}.mjs`)
    if (existsSync(file)) return file
    dir = dirname(dir)
  }
  return null
}
