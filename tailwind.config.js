/**
 * Hairline's palette: warm drafting paper, blue-black ink, and two signal
 * colours used sparingly (verdigris for "holds", rust for "fragile").
 * Colour never carries meaning alone: classes also get a glyph and a label.
 * @type {import('tailwindcss').Config}
 */
module.exports = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  presets: [require('nativewind/preset')],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#F3F0E8', deep: '#E9E4D8', card: '#FBFAF6' },
        ink: { DEFAULT: '#1D2733', soft: '#3C4A5A', faint: '#6B7785' },
        rule: { DEFAULT: '#D6CFBF', strong: '#B9B09C' },
        verdigris: { DEFAULT: '#2E7D6B', soft: '#D5E8E1' },
        rust: { DEFAULT: '#A84B2A', soft: '#F2DDD3' },
        ochre: { DEFAULT: '#B4862B', soft: '#F1E6C8' },
      },
      fontFamily: {
        sans: ['SpaceGrotesk_400Regular'],
        medium: ['SpaceGrotesk_500Medium'],
        bold: ['SpaceGrotesk_700Bold'],
        mono: ['JetBrainsMono_400Regular'],
        'mono-bold': ['JetBrainsMono_700Bold'],
      },
    },
  },
  plugins: [],
};
