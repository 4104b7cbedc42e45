import type { Config } from 'tailwindcss'

// Brinkwater's own palette: deep water neutrals, a tide accent, and alert colours chosen to
// stay distinct for common colour-vision deficiencies (blue/orange axis, not red/green alone).
export default {
  darkMode: 'class',
  content: ['./app/**/*.{vue,ts}', './shared/**/*.ts'],
  theme: {
    extend: {
      colors: {
        abyss: {
          50: '#f3f6f8', 100: '#e3e9ee', 200: '#c6d2dc', 300: '#9fb1c1', 400: '#7189a0',
          500: '#526c84', 600: '#40566b', 700: '#334457', 800: '#233041', 900: '#17202c', 950: '#0d131b',
        },
        tide: {
          50: '#eefaff', 100: '#d6f1fb', 200: '#ade3f6', 300: '#74cdee', 400: '#36afdf',
          500: '#1391c3', 600: '#0b73a0', 700: '#0d5c81', 800: '#114d6a', 900: '#13405a', 950: '#0b293c',
        },
        flare: {
          50: '#fff8ec', 100: '#ffeed0', 200: '#ffd99c', 300: '#ffbd5e', 400: '#fd9a2e',
          500: '#f07b10', 600: '#d25d08', 700: '#ab420b', 800: '#8a3510', 900: '#712d10',
        },
        coral: { 400: '#f2707a', 500: '#e0475a', 600: '#c22f45', 700: '#9f2339' },
        kelp: { 400: '#5fc4a4', 500: '#2fa886', 600: '#1f876b', 700: '#1b6b57' },
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
        mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace'],
      },
      fontSize: {
        // Type scale: 1.2 ratio from 15px, with projector sizes for the wall view.
        'xs': ['0.78rem', { lineHeight: '1.1rem' }],
        'sm': ['0.875rem', { lineHeight: '1.3rem' }],
        'base': ['0.9375rem', { lineHeight: '1.5rem' }],
        'lg': ['1.125rem', { lineHeight: '1.65rem' }],
        'xl': ['1.35rem', { lineHeight: '1.9rem' }],
        '2xl': ['1.62rem', { lineHeight: '2.1rem' }],
        '3xl': ['1.944rem', { lineHeight: '2.4rem' }],
        'wall': ['3.2rem', { lineHeight: '3.6rem' }],
        'wall-xl': ['5rem', { lineHeight: '5.4rem' }],
      },
      borderRadius: { card: '0.6rem' },
    },
  },
  plugins: [],
} satisfies Config
