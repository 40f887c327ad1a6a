/** Boardwright's print palette: the app's ink, copper and verdict tones, for every printed document. */
export const PRINT_INK = '#1f2a37';
export const PRINT_SOFT = '#4b5563';
export const PRINT_FAINT = '#8a93a0';
export const PRINT_COPPER = '#b5652b';
export const VERDICT_TONES = { passes: '#2f7d4f', 'near-limit': '#9a6a00', fails: '#b3261e' } as const;
