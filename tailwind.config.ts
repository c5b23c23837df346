import type { Config } from 'tailwindcss';

/**
 * Phasewright's palette and scales. Named in the product's own vocabulary;
 * docs/design-system.md says what each colour is for. Every colour comes with
 * a `soft` tint (backgrounds, chips) and a `deep` shade (text on the tint).
 */
const config: Config = {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        // Neutrals: the working surface and the ink on it.
        paper: { DEFAULT: '#F6F5F1', raised: '#FFFFFF', sunken: '#ECEAE4' },
        rule: { DEFAULT: '#D9D5CB', strong: '#B9B4A8' },
        ink: { DEFAULT: '#23272D', muted: '#585E67', faint: '#858B94', inverse: '#F6F5F1' },
        // The one colour for actions, links, focus and the current place.
        accent: { DEFAULT: '#3B4C86', deep: '#2C3A69', soft: '#E6E9F4' },
        // One colour per phase a stream or port can be in.
        phase: {
          organic: { DEFAULT: '#B48424', deep: '#6F5012', soft: '#F5ECD7' },
          aqueous: { DEFAULT: '#2C8797', deep: '#175460', soft: '#DCEFF2' },
          solid: { DEFAULT: '#7B6450', deep: '#4C3C2E', soft: '#EDE6DF' },
          vapour: { DEFAULT: '#8F86B3', deep: '#564E7A', soft: '#ECEAF4' },
        },
        // One colour per severity of a caution, always paired with its word.
        caution: {
          info: { DEFAULT: '#56708A', deep: '#334559', soft: '#E6ECF1' },
          advisory: { DEFAULT: '#7F8A2B', deep: '#4A5216', soft: '#EEF0DA' },
          warning: { DEFAULT: '#C4631D', deep: '#7E3D0E', soft: '#F8E6D9' },
          hazard: { DEFAULT: '#A3303C', deep: '#6E1C25', soft: '#F5DFE1' },
        },
      },
      fontFamily: {
        sans: ['Lexend', 'system-ui', 'sans-serif'],
      },
      // A dense scale for a working tool: body text is 14 px.
      fontSize: {
        // In px: the page's root size is the 14 px body text, so rem sizes would come out 7/8 of the scale.
        caption: ['12px', { lineHeight: '16px' }],
        small: ['13px', { lineHeight: '18px' }],
        body: ['14px', { lineHeight: '20px' }],
        lead: ['16px', { lineHeight: '24px' }],
        title: ['18px', { lineHeight: '24px' }],
        heading: ['22px', { lineHeight: '28px' }],
        display: ['28px', { lineHeight: '34px' }],
      },
      // Spacing stays on Tailwind's 4 px grid; these name the layout measures.
      spacing: {
        rail: '13rem',
        bar: '3rem',
        gutter: '1.5rem',
      },
      maxWidth: {
        page: '72rem',
        form: '26rem',
      },
      borderRadius: {
        control: '4px',
        card: '6px',
      },
      boxShadow: {
        card: '0 1px 2px rgba(35, 39, 45, 0.06), 0 1px 1px rgba(35, 39, 45, 0.04)',
        overlay: '0 8px 24px rgba(35, 39, 45, 0.18)',
      },
    },
  },
};

export default config;
