import type { Config } from 'tailwindcss'

export default {
  content: [],
  theme: {
    extend: {
      fontFamily: { sans: ['Inter', 'system-ui', 'sans-serif'] },
      colors: {
        // Passagewright's own palette: deep teal ink on sand-white paper, brass accents
        ink: { 50: '#f1f6f6', 100: '#dcebea', 200: '#b7d6d4', 300: '#86b8b5', 400: '#559592', 500: '#3b7976', 600: '#2e605e', 700: '#274e4d', 800: '#223f3f', 900: '#1b3232', 950: '#0d1d1d' },
        brass: { 50: '#fbf7ec', 100: '#f4e9c9', 200: '#e9d293', 300: '#ddb65c', 400: '#d39f3a', 500: '#c0832a', 600: '#a56523', 700: '#854a20', 800: '#6e3d20', 900: '#5d331e' },
        paper: '#fbfaf6',
      },
    },
  },
} satisfies Config
