import { formatKappa, kappaBand } from './kappa-bands';

// Band edges of Landis & Koch (1977), from memory: <0, 0–.20, .21–.40, .41–.60, .61–.80, .81–1.
describe('kappaBand', () => {
  it.each([
    [-0.3, 'poor agreement'],
    [-0.006, 'poor agreement'],
    [-0.001, 'slight agreement'], // shown as 0.00
    [0, 'slight agreement'],
    [0.2, 'slight agreement'],
    [0.204, 'slight agreement'],
    [0.21, 'fair agreement'],
    [0.4, 'fair agreement'],
    [0.41, 'moderate agreement'],
    [0.6, 'moderate agreement'],
    [0.61, 'substantial agreement'],
    [0.8, 'substantial agreement'],
    [0.81, 'almost perfect agreement'],
    [1, 'almost perfect agreement'],
  ])('%p reads as %p', (kappa, word) => {
    expect(kappaBand(kappa).word).toBe(word);
  });
});

describe('formatKappa', () => {
  it('shows two decimals with a real minus sign and no negative zero', () => {
    expect(formatKappa(0.6375)).toBe('0.64');
    expect(formatKappa(-0.12)).toBe('−0.12');
    expect(formatKappa(-0.001)).toBe('0.00');
    expect(formatKappa(null)).toBe('—');
  });
});
