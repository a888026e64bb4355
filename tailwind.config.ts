import type { Config } from 'tailwindcss'

// Tonewright's own palette: warm workshop paper, ink, a spruce green for "within",
// a kiln orange for "sharp" and a slate blue for "flat" (an orange/blue pair stays
// distinguishable for the common colour-vision deficiencies; shape and text carry
// the verdict as well).
export default {
  content: ['./app/**/*.{vue,ts}', './shared/**/*.ts'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
      },
      colors: {
        paper: { DEFAULT: '#f6f3ec', deep: '#ece6d9', line: '#d9d0bd' },
        ink: { DEFAULT: '#1f2329', soft: '#4a5059', faint: '#7b818a' },
        spruce: { 50: '#eaf4ef', 100: '#cfe6da', 500: '#2f7d5b', 600: '#25664a', 700: '#1c4f39' },
        kiln: { 50: '#fbeee6', 100: '#f5d3bf', 500: '#c45a1c', 600: '#a34812', 700: '#7f370c' },
        slate: { 50: '#ebf0f8', 100: '#cdd9ec', 500: '#3b62a8', 600: '#2f4f8a', 700: '#243d6b' },
        brass: { 100: '#f3e6c4', 400: '#c9a13f', 500: '#a9832a', 700: '#6e5416' },
      },
      boxShadow: { plate: '0 1px 0 rgba(31,35,41,0.06), 0 1px 3px rgba(31,35,41,0.08)' },
    },
  },
  plugins: [],
} satisfies Config
