import type { Config } from 'tailwindcss';

// Kilowatch's own palette, type scale and spacing; the reasoning is in docs/decisions/001-visual-identity.md.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        // Hull: blue-green slate for the console bar, headings and body text.
        hull: {
          50: '#f1f6f6',
          100: '#e2ebec',
          200: '#c5d6d8',
          300: '#9bb7bb',
          400: '#6f959b',
          500: '#4c747b',
          600: '#365a61',
          700: '#28444a',
          800: '#1d3237',
          900: '#142226',
          950: '#0c1518',
        },
        // Deck: warm paper neutrals for page and panel backgrounds and rules.
        deck: {
          50: '#f7f5f0',
          100: '#eeebe3',
          200: '#dfd9cc',
          300: '#c8bfad',
          400: '#a89d87',
          500: '#877c67',
          600: '#6a614f',
          700: '#524b3d',
        },
        // Brass: the one accent, for primary actions, focus rings and the logo needle.
        brass: {
          50: '#fdf6e7',
          100: '#f9e8c2',
          200: '#f2d08a',
          300: '#e8b553',
          400: '#dc9c2c',
          500: '#c4821a',
          600: '#a06513',
          700: '#7c4d12',
          800: '#5e3b12',
        },
        // Signal: errors and destructive actions.
        signal: {
          50: '#fdf0ee',
          100: '#f9d9d4',
          500: '#c23a2b',
          600: '#a32d21',
          700: '#84251c',
        },
        // Verdigris: confirmations.
        verdigris: {
          50: '#edf7f2',
          100: '#d3ede0',
          500: '#2f8a61',
          700: '#1f5e42',
        },
      },
      fontFamily: {
        sans: ['"Nunito Sans"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
      // A compact scale (ratio about 1.2) suited to dense engine-room tables.
      fontSize: {
        caption: ['0.75rem', { lineHeight: '1rem', letterSpacing: '0.04em' }],
        small: ['0.8125rem', { lineHeight: '1.25rem' }],
        body: ['0.9375rem', { lineHeight: '1.5rem' }],
        lead: ['1.125rem', { lineHeight: '1.625rem' }],
        title: ['1.375rem', { lineHeight: '1.875rem', letterSpacing: '-0.005em' }],
        display: ['1.75rem', { lineHeight: '2.25rem', letterSpacing: '-0.01em' }],
      },
      spacing: {
        gutter: '1.25rem',
        bay: '2.5rem',
        panel: '28rem',
      },
      maxWidth: {
        sheet: '76rem',
        form: '34rem',
      },
      borderRadius: {
        plate: '0.3125rem',
      },
      boxShadow: {
        plate: '0 1px 0 rgba(20, 34, 38, 0.06), 0 1px 3px rgba(20, 34, 38, 0.08)',
      },
    },
  },
  plugins: [],
} satisfies Config;
