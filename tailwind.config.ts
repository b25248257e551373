import type { Config } from 'tailwindcss';

// Skywell's palette (product.md, Look): ink and slate backgrounds for dark
// production rooms, teal and violet accents, and the orbit-band ramp
// teal -> blue -> indigo -> near-black (never a traffic-light scheme).
export default {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: { 950: '#05070c', 900: '#0a0e17', 800: '#111726', 700: '#1a2233' },
        slate: { 600: '#3b4659', 500: '#5b6880', 400: '#8592a8', 300: '#b3bdcc', 200: '#d6dce6' },
        teal: { 300: '#6fe3d3', 400: '#36cdb9', 500: '#1fae9c', 600: '#17887a' },
        violet: { 300: '#c4b5fd', 400: '#a78bfa', 500: '#8b6cf0', 600: '#6d4fd6' },
        band: { stable: '#2bb3a3', unstable: '#2f6fd0', none: '#3b2f9a', interior: '#0d0b1f' },
        danger: { 400: '#f08a9a', 500: '#e0607a' },
      },
      fontFamily: { sans: ['Inter', 'ui-sans-serif', 'system-ui', 'sans-serif'] },
    },
  },
} satisfies Config;
