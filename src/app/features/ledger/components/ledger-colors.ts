// The ledger charts' colours, from the theme's palettes; each keeps 3:1 against the page (WCAG 2.2 non-text contrast),
// and a legend word always names what a colour stands for.
export const LEDGER_COLORS = {
  /** Warm grey, neutral tone 50: drawn as a line across the bars, a limit rather than money. */
  budget: '#7c7670',
  /** Petrol, primary tone 30. */
  netCost: '#1d4c5d',
  /** Brass, tertiary tone 60. */
  forecast: '#b8892b',
} as const;
