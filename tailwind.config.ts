import type { Config } from 'tailwindcss';

// Rackturn's own palette: dark ink blue, warm chalk white, one rust accent; states always pair
// their colour with an icon and words.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['Barlow', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
      colors: {
        ink: {
          950: '#0a111e',
          900: '#111b2e',
          800: '#1a2740',
          700: '#253553',
          600: '#364a70',
          500: '#52658c',
          400: '#7d8bab',
          300: '#a9b3c9',
          200: '#cfd5e2',
        },
        chalk: {
          50: '#fcfaf6',
          100: '#f5f1e8',
          200: '#ebe4d5',
          300: '#dad0bb',
          400: '#c2b598',
        },
        rust: {
          300: '#e8a081',
          400: '#d9764f',
          500: '#b54e28', // 4.85:1 under chalk-50 text (WCAG AA asks 4.5:1)
          600: '#a44524',
          700: '#83361c',
        },
        clean: { 100: '#dcefe4', 600: '#2f7d57', 700: '#246445' },
        caution: { 100: '#f8ecd0', 600: '#a8741a', 700: '#87590f' },
        breach: { 100: '#f6dcd8', 600: '#b3362d', 700: '#8f2820' },
      },
    },
  },
} satisfies Config;
