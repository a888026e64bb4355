import { createRequire } from 'node:module'
import { existsSync } from 'node:fs'
import { dirname, join, resolve, sep } from 'node:path'
import pdfmake from 'pdfmake'

/**
 * The folder of one complete (not script-split) woff set: pdfmake has no per-glyph
 * fallback, so ¢, −, ±, ° and Δ must all be in the one file. Looked up from the
 * server bundle and from the working directory (the built server does not copy fonts).
 */
function fontDir(pkg: string): string {
  const bases = [import.meta.url, join(process.cwd(), 'package.json')]
  for (const base of bases) {
    try {
      const dir = join(dirname(createRequire(base).resolve(`${pkg}/package.json`)), 'fonts', 'complete', 'woff')
      if (existsSync(dir)) return dir
    }
    catch { /* try the next base */ }
  }
  const fallback = resolve(process.cwd(), 'node_modules', pkg, 'fonts', 'complete', 'woff')
  if (existsSync(fallback)) return fallback
  throw new Error(`The certificate fonts (${pkg}) were not found; run npm ci.`)
}

let configured = false
/** Registers the Plex fonts with pdfmake once per process (or worker thread). */
export function configurePdfFonts() {
  if (configured) return
  const sans = fontDir('@ibm/plex-sans')
  const mono = fontDir('@ibm/plex-mono')
  pdfmake.setFonts({
    Plex: {
      normal: join(sans, 'IBMPlexSans-Regular.woff'),
      bold: join(sans, 'IBMPlexSans-SemiBold.woff'),
      italics: join(sans, 'IBMPlexSans-Italic.woff'),
      bolditalics: join(sans, 'IBMPlexSans-SemiBoldItalic.woff'),
    },
    PlexMono: {
      normal: join(mono, 'IBMPlexMono-Regular.woff'),
      bold: join(mono, 'IBMPlexMono-SemiBold.woff'),
      italics: join(mono, 'IBMPlexMono-Italic.woff'),
      bolditalics: join(mono, 'IBMPlexMono-SemiBoldItalic.woff'),
    },
  })
  // Only the two font folders may be read; nothing is fetched from the network.
  pdfmake.setLocalAccessPolicy(path => [sans, mono].some(dir => resolve(path).startsWith(dir + sep)))
  pdfmake.setUrlAccessPolicy(() => false)
  configured = true
}
