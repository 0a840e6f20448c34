import type { Config } from 'tailwindcss'

// Voltwright's look: a workshop manual, graphite on warm paper with one copper accent.
// Safety colours follow ISO 3864 and are used only where they carry that meaning.
export default {
  content: ['./app/**/*.{vue,ts}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f6f2ea', deep: '#ece5d8', edge: '#d9cfbd' },
        graphite: { DEFAULT: '#2a2926', soft: '#4a4843', mute: '#6b675f' },
        copper: { DEFAULT: '#a4551f', dark: '#7e3f14', light: '#f1dccb' },
        danger: { DEFAULT: '#b3261e', light: '#f9e0dd' },
        caution: { DEFAULT: '#f2c230', dark: '#6b5200', light: '#fdf3cf' },
        pass: { DEFAULT: '#2e7d32', dark: '#1b5e20', light: '#e0f0e1' }
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif']
      }
    }
  }
} satisfies Config
