import { jStat } from './reference-libraries.testing';
import { studentTCentral, studentTCritical } from './student-t';

describe('Student t', () => {
  test('central probability matches jStat.studentt.cdf for many df (jStat itself is good to about 1e-7)', () => {
    for (const df of [1, 2, 3, 4, 5, 7, 10, 25, 60]) {
      for (const t of [0, 0.3, 1, 2, 3.5, 8]) expect(Math.abs(studentTCentral(t, df) - (2 * jStat.studentt.cdf(t, df) - 1))).toBeLessThan(1e-7);
    }
  });

  test('central probability against closed forms: df 1 → (2/π)·atan t, df 2 → t/√(2 + t²), df 3 → (2/π)(θ + sinθ cosθ)', () => {
    for (const t of [0, 0.3, 1, 2, 3.5, 8]) {
      expect(studentTCentral(t, 1)).toBeCloseTo((2 / Math.PI) * Math.atan(t), 14);
      expect(studentTCentral(t, 2)).toBeCloseTo(t / Math.sqrt(2 + t * t), 14);
      const theta = Math.atan(t / Math.sqrt(3));
      expect(studentTCentral(t, 3)).toBeCloseTo((2 / Math.PI) * (theta + Math.sin(theta) * Math.cos(theta)), 14);
    }
  });

  test('t₀.₉₇₅ against closed forms (df 1: tan(0.475π); df 2: √(0.95²·2/(1 − 0.95²))) and jStat.studentt.inv', () => {
    expect(studentTCritical(0.95, 1)).toBeCloseTo(Math.tan(0.475 * Math.PI), 10);
    expect(studentTCritical(0.95, 2)).toBeCloseTo(Math.sqrt((0.95 ** 2 * 2) / (1 - 0.95 ** 2)), 12);
    for (const df of [3, 4, 6, 8, 10, 20, 40]) expect(studentTCritical(0.95, df)).toBeCloseTo(jStat.studentt.inv(0.975, df), 6);
  });

  test('bad df throws', () => {
    expect(() => studentTCentral(1, 0)).toThrow(RangeError);
    expect(() => studentTCentral(1, 2.5)).toThrow(RangeError);
    expect(() => studentTCritical(1.2, 3)).toThrow(RangeError);
  });
});
