export interface LineFit {
  points: number;
  slope: number;
  intercept: number;
  /** Standard error of the slope, √(SSE/(n − 2) / Sxx); null with fewer than 3 points. */
  slopeStandardError: number | null;
  /** n − 2, the degrees of freedom of the slope's t interval. */
  degreesOfFreedom: number;
}

/**
 * Ordinary least-squares line y = intercept + slope·x. Null with fewer than 2 points or when every x
 * is the same (no slope exists).
 */
export function fitLine(points: readonly (readonly [x: number, y: number])[]): LineFit | null {
  const n = points.length;
  if (n < 2) return null;
  let meanX = 0;
  let meanY = 0;
  for (const [x, y] of points) {
    if (!Number.isFinite(x) || !Number.isFinite(y)) throw new RangeError('fitLine needs finite numbers');
    meanX += x / n;
    meanY += y / n;
  }
  let sxx = 0;
  let sxy = 0;
  for (const [x, y] of points) {
    sxx += (x - meanX) ** 2;
    sxy += (x - meanX) * (y - meanY);
  }
  if (sxx === 0) return null;
  const slope = sxy / sxx;
  const intercept = meanY - slope * meanX;
  let sse = 0;
  for (const [x, y] of points) sse += (y - intercept - slope * x) ** 2;
  const slopeStandardError = n < 3 ? null : Math.sqrt(sse / (n - 2) / sxx);
  return { points: n, slope, intercept, slopeStandardError, degreesOfFreedom: n - 2 };
}
