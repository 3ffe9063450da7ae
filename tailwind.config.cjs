/** Bondmap's tokens (shared/design/screens.md): ink on paper, one teal accent, severity colours. */
/** @type {import('tailwindcss').Config} */
module.exports = {
  content: ['./src/**/*.{astro,html,ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['"Source Sans 3"', 'system-ui', 'sans-serif'] },
      colors: {
        ink: '#1b2330',
        paper: '#f7f7f4',
        accent: { DEFAULT: '#0f766e', dark: '#0b5a54' },
        line: '#d0d5dd',
        blocker: '#b42318',
        warning: '#b54708',
        note: '#475467',
        clear: '#067647',
      },
      minHeight: { touch: '44px' },
      minWidth: { touch: '44px' },
    },
  },
  plugins: [],
};
