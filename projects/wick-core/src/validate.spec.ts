import { DomainError } from './errors';
import { requireContactAngle, requireFraction, requirePositive } from './validate';

describe('input guards', () => {
  it('rejects NaN, Infinity and non-positive values with a DomainError naming the field', () => {
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, 0, -1]) {
      expect(() => requirePositive('radius', bad)).toThrowMatching(
        (e) => e instanceof DomainError && e.field === 'radius',
      );
    }
    expect(requirePositive('radius', 1e-6)).toBe(1e-6);
  });

  it('keeps porosity strictly inside (0, 1)', () => {
    expect(() => requireFraction('porosity', 0)).toThrowError(DomainError, /porosity must lie in \(0, 1\)/);
    expect(() => requireFraction('porosity', 1)).toThrowError(DomainError);
    expect(requireFraction('porosity', 0.9)).toBe(0.9);
  });

  it('accepts contact angles from 0° to 180° and quotes degrees when refusing', () => {
    expect(requireContactAngle('contactAngle', Math.PI)).toBe(Math.PI);
    expect(() => requireContactAngle('contactAngle', Math.PI * 1.1)).toThrowError(DomainError, /198\.00°/);
  });
});
