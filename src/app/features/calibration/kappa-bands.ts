/**
 * Words for Cohen's kappa, after the bands of Landis & Koch (1977), from memory: below 0 poor,
 * 0–0.20 slight, 0.21–0.40 fair, 0.41–0.60 moderate, 0.61–0.80 substantial, 0.81–1 almost perfect.
 * The bands are a convention, not a test: the page shows them beside every word it uses.
 */
export const KAPPA_BANDS = [
  { upTo: 0, word: 'poor agreement', range: 'below 0', symbol: '✗' },
  { upTo: 0.2, word: 'slight agreement', range: '0.00–0.20', symbol: '◔' },
  { upTo: 0.4, word: 'fair agreement', range: '0.21–0.40', symbol: '◑' },
  { upTo: 0.6, word: 'moderate agreement', range: '0.41–0.60', symbol: '◕' },
  { upTo: 0.8, word: 'substantial agreement', range: '0.61–0.80', symbol: '●' },
  { upTo: 1, word: 'almost perfect agreement', range: '0.81–1.00', symbol: '✓' },
] as const;

export const KAPPA_SOURCE = 'Landis & Koch (1977), from memory';

/** Fewer snaps compared than this and the page warns that kappa can swing a lot (our choice). */
export const KAPPA_FEW_SNAPS = 30;

export type KappaBand = (typeof KAPPA_BANDS)[number];

/**
 * The band of a kappa, decided on the two decimals shown so the word always matches the number on
 * screen. A band's upper bound belongs to it (0.20 is slight); only a shown value below 0 is poor.
 */
export function kappaBand(kappa: number): KappaBand {
  const shown = Number(kappa.toFixed(2));
  if (shown < 0) return KAPPA_BANDS[0];
  return KAPPA_BANDS.slice(1).find((b) => shown <= b.upTo) ?? KAPPA_BANDS[KAPPA_BANDS.length - 1];
}

/** κ with two decimals and a true minus sign: "0.64", "−0.12". */
export function formatKappa(kappa: number | null): string {
  if (kappa === null) return '—';
  const text = Math.abs(kappa).toFixed(2);
  return kappa < 0 && text !== '0.00' ? `−${text}` : text;
}
