import type { Config } from 'tailwindcss';

// The tokens of shared/design/LOOK.md. Text colours are chosen for AA on paper, card, paper-2 and
// the soft fills; brass alone is too light for text and is meant for borders only.
export default {
  theme: {
    // Square corners throughout: replacing (not extending) the scale means `rounded-lg` and friends
    // simply do not exist, so nobody can round a card by accident.
    borderRadius: {
      none: '0',
      sm: '1px',
      DEFAULT: '2px',
    },
    extend: {
      colors: {
        paper: '#F5F0E6',
        'paper-2': '#EBE4D6',
        card: '#FFFCF6',
        ink: '#1E1B18',
        'ink-2': '#4A443D',
        slate: '#66625B',
        rule: '#D6CCBA',
        oxide: '#A3412A',
        'oxide-2': '#7E2F1C',
        brass: '#A8823F',
        'brass-text': '#7A5A1E',
        'brass-soft': '#F1E6CC',
        gauge: '#3E6A4E',
        'gauge-soft': '#DDEBDF',
        caution: '#8A5A00',
        'caution-soft': '#FBEFD2',
      },
      fontFamily: {
        serif: ['Merriweather', 'Georgia', 'serif'],
        sans: ['Barlow', 'system-ui', 'sans-serif'],
        condensed: ['"Barlow Condensed"', 'Barlow', 'system-ui', 'sans-serif'],
        mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace'],
      },
      letterSpacing: {
        label: '0.12em',
      },
      maxWidth: {
        measure: '68ch',
      },
    },
  },
} satisfies Config;
