import type { Config } from 'tailwindcss'
import { lookClassNames } from './shared/look/meanings'
import { PALETTE, withAlpha } from './shared/look/palette'

// The colours come from shared/look/palette.ts (also read by the charts, the e-mails
// and the certificate PDF); the classes of the verdict, stage and status looks are built
// in shared/look/meanings.ts, so they are kept here by name.
export default {
  content: ['./app/**/*.{vue,ts}', './shared/**/*.ts'],
  safelist: lookClassNames(),
  theme: {
    extend: {
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
      },
      colors: PALETTE,
      boxShadow: { plate: `0 1px 0 ${withAlpha(PALETTE.ink.DEFAULT, 0.06)}, 0 1px 3px ${withAlpha(PALETTE.ink.DEFAULT, 0.08)}` },
    },
  },
  plugins: [],
} satisfies Config
