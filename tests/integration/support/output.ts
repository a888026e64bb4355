import { fileURLToPath } from 'node:url'
import { join } from 'node:path'

/** The folder scripts/test.sh builds the test server into (never the .output a running `npm start` serves). */
export const OUTPUT_DIR = process.env.TW_OUTPUT_DIR ?? fileURLToPath(new URL('../../../.data/test-output/', import.meta.url))

/** The built server's entry file. */
export const SERVER_ENTRY = join(OUTPUT_DIR, 'server', 'index.mjs')
