import type { Config } from 'tailwindcss';

// Colours and fonts are CSS variables in app/globals.css; only values that are easier
// to keep in JavaScript live here. Tailwind v4 finds the sources itself, so no `content`.
const config = {
  theme: {
    extend: {
      // Smallest comfortable touch target for buttons and form controls.
      minHeight: { touch: '44px' },
      minWidth: { touch: '44px' },
    },
  },
} satisfies Config;

export default config;
