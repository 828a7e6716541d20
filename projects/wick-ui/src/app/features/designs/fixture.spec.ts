import { evaluateVariant, fixtureKeys, fixtureMismatches, type VariantFixture } from 'wick-core';
import fixtureJson from '../../../../../wick-core/src/design/fixture/variants.json';

/**
 * The shared variant fixture, recomputed in the browser (headless Chromium): the numbers the design workspace
 * shows live must equal the ones wick-core produced in Node and the server records, to round-off.
 */
describe('shared variant fixture in the browser', () => {
  const fixture = fixtureJson as unknown as VariantFixture;

  it('covers every configuration', () => {
    expect(new Set(fixture.cases.map((c) => c.inputs.configuration)).size).toBe(5);
  });

  for (const c of fixture.cases) {
    it(`recomputes "${c.name}" to round-off`, () => {
      expect(fixtureMismatches(c.expected, fixtureKeys(evaluateVariant(c.inputs, c.options)))).toEqual([]);
    });
  }
});
