import { show, showFigure, showRelative } from './format';

describe('result formatting', () => {
  it('reads volumes in mL and volume fractions in per cent (1 mL = 1e-6 m³, by definition)', () => {
    expect(show(2.224e-5, 'm^3')).toBe('22.24 mL');
    expect(showFigure({ value: 0.795, unit: 'm^3/m^3' })).toBe('79.5 %');
  });

  it('shows round-off between equal figures as no change, real changes with their sign', () => {
    expect(showRelative(1.9e-16)).toBe('±0 %');
    expect(showRelative(-4.4e-16)).toBe('±0 %');
    expect(showRelative(0.34)).toBe('+34 %');
    expect(showRelative(-0.333)).toBe('−33 %');
    expect(showRelative(null)).toBe('');
  });
});
