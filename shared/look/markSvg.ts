import { lookHex, MEANINGS, type Look, type Meaning, type Shape } from './meanings'
import { hex } from './palette'

const SHAPES: Record<Shape, (colour: string, edge: string) => string> = {
  'disc': c => `<circle cx="7" cy="7" r="6" fill="${c}"/>`,
  'triangle-up': c => `<polygon points="7,1 13,13 1,13" fill="${c}"/>`,
  'triangle-down': c => `<polygon points="1,1 13,1 7,13" fill="${c}"/>`,
  'open-square': c => `<rect x="2" y="2" width="10" height="10" fill="none" stroke="${c}" stroke-width="2"/>`,
  'ring': c => `<circle cx="7" cy="7" r="5" fill="none" stroke="${c}" stroke-width="2"/>`,
  'dot-ring': c => `<circle cx="7" cy="7" r="5" fill="none" stroke="${c}" stroke-width="2"/><circle cx="7" cy="7" r="1.8" fill="${c}"/>`,
  'crossed-square': c => `<g fill="none" stroke="${c}" stroke-width="2"><rect x="1.5" y="1.5" width="11" height="11"/><path d="M4 4l6 6M10 4l-6 6"/></g>`,
  'check': c => `<path d="M2 7.5l3.2 3.2L12 3.5" fill="none" stroke="${c}" stroke-width="2.4"/>`,
  'cross': c => `<path d="M3 3l8 8M11 3l-8 8" stroke="${c}" stroke-width="2.4"/>`,
  'clock': c => `<g fill="none" stroke="${c}" stroke-width="1.6"><circle cx="7" cy="7" r="5.5"/><path d="M7 3.8V7l2.2 1.6"/></g>`,
  'return-arrow': c => `<g fill="none" stroke="${c}" stroke-width="1.8" stroke-linecap="round" stroke-linejoin="round"><path d="M3.2 5.2A4.6 4.6 0 1 1 2.6 8.4"/><path d="M2.6 2.2v3.2h3.2"/></g>`,
  'half-disc': c => `<circle cx="7" cy="7" r="5.5" fill="none" stroke="${c}" stroke-width="1.6"/><path d="M7 1.5a5.5 5.5 0 0 0 0 11z" fill="${c}"/>`,
  'swatch': c => `<rect x="1" y="1" width="12" height="12" rx="2" fill="${c}"/>`,
  'warning-sign': (c, edge) => `<polygon points="7,1.2 13,12.6 1,12.6" fill="${c}" stroke="${edge}" stroke-width="1.4" stroke-linejoin="round"/><path d="M7 5v3.6M7 10.2v.9" stroke="${edge}" stroke-width="1.6"/>`,
}

/** A meaning's mark as a standalone SVG (for documents that are not Vue: the certificate PDF). */
export function markSvg(meaning: Meaning, sizePx: number): string {
  const look: Look = MEANINGS[meaning]
  const draw = SHAPES[look.shape]
  return `<svg width="${sizePx}" height="${sizePx}" viewBox="0 0 14 14">${draw(lookHex(meaning).colour, hex(look.outline ?? look.colour))}</svg>`
}
