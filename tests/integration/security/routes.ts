import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { fileURLToPath } from 'node:url'

const API_DIR = fileURLToPath(new URL('../../../server/api', import.meta.url))

/** Every route file under server/api, as "METHOD /api/path/:param". */
export function allRoutes(dir = API_DIR): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name)
    if (statSync(path).isDirectory()) return allRoutes(path)
    const match = /^(.*)\.(get|post|put|patch|delete)\.ts$/.exec(relative(API_DIR, path))
    if (!match) return []
    const route = `/api/${match[1]!.replace(/(^|\/)index$/, '')}`.replace(/\/$/, '').replace(/\[(\w+)\]/g, ':$1')
    return [`${match[2]!.toUpperCase()} ${route}`]
  })
}
