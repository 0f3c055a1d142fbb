import { systemIsOfKind, tradeWordMatches, wordsOf } from './trade-word-match';
import { TRADE_WORDS } from './trade-words';

const kindOf = (name: string) => TRADE_WORDS.find((vocabulary) => vocabulary.kind === name)!;
const found = (description: string) => tradeWordMatches(description).map((match) => [match.vocabulary.kind, match.word, match.weight]);

describe('the trade-word vocabulary (common practice)', () => {
  it('holds each word once per kind, in the form descriptions are compared in', () => {
    for (const vocabulary of TRADE_WORDS) {
      const words = vocabulary.words.map(wordsOf);
      expect(words.every((word) => word.length > 0)).toBe(true);
      expect(new Set(words).size).toBe(words.length);
      expect(vocabulary.systemWords.every((word) => wordsOf(word) === word)).toBe(true);
    }
  });

  it('marks the default systems of a new build by their names', () => {
    expect(systemIsOfKind('Cooling', kindOf('cooling'))).toBe(true);
    expect(systemIsOfKind('Wiring harness', kindOf('wiring'))).toBe(true);
    expect(systemIsOfKind('Brakes', kindOf('brake'))).toBe(true);
    expect(systemIsOfKind('Tools and consumables', kindOf('shop supplies'))).toBe(true);
    expect(systemIsOfKind('Safety and track inspection', kindOf('safety'))).toBe(true);
    expect(systemIsOfKind('Engine', kindOf('cooling'))).toBe(false);
    // A word inside another word is not the word: "Fuelling" is not "fuel".
    expect(systemIsOfKind('Fuelling', kindOf('fuel'))).toBe(false);
  });
});

describe('tradeWordMatches', () => {
  it.each([
    { description: 'Thermostat 82C', expected: [['cooling', 'thermostat', 1]] },
    { description: 'RELAYS, 4 PIN', expected: [['wiring', 'relay', 1]] },
    { description: 'Hose clamps 32mm', expected: [['cooling', 'hose clamp', 3]] },
    { description: 'Front brake pads', expected: [['brake', 'brake pads', 3]] },
    { description: 'Brake fluid DOT 4', expected: [['brake', 'brake fluid', 2], ['fluids', 'fluid', 1]] },
    { description: 'Gear oil 75W-90', expected: [['drivetrain', 'gear oil', 2], ['fluids', 'oil', 1]] },
    { description: 'Submersible fuel hose 3/8', expected: [['fuel', 'fuel hose', 3], ['cooling', 'hose', 1]] },
    { description: 'CV joint boot', expected: [['drivetrain', 'cv joint', 3]] },
    { description: 'Invoice 7731', expected: [] },
  ])('finds $expected in "$description"', ({ description, expected }) => {
    expect(found(description)).toEqual(expected);
  });
});
