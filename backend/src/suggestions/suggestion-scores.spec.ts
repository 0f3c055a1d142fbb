import { descriptionScore, HISTORY_SIMILARITY, historyScore, partNumberScore, tradeWordScore } from './suggestion-scores';

// The bands must not overlap, or a weaker source could outrank a stronger one.
describe('the score bands rank the sources in a fixed order', () => {
  const history = { lowest: historyScore(HISTORY_SIMILARITY, false, false), highest: historyScore(1, true, false) };

  it.each([
    { stronger: 'a remembered choice (same shop and part number)', lowest: historyScore(0, true, true), weaker: 'part-number', highest: partNumberScore(1) },
    { stronger: 'part-number', lowest: partNumberScore(0), weaker: 'other history', highest: Math.max(history.highest, historyScore(1, false, true)) },
    { stronger: 'history', lowest: history.lowest, weaker: 'similar-description', highest: descriptionScore(1) },
    { stronger: 'similar-description', lowest: descriptionScore(0.3), weaker: 'trade-word', highest: tradeWordScore(10) },
  ])('$stronger at its lowest beats $weaker at its highest', ({ lowest, highest }) => {
    expect(lowest).toBeGreaterThan(highest);
  });

  it('gives the worked values of the scale', () => {
    expect([partNumberScore(0), partNumberScore(1)].map((s) => Number(s.toFixed(10)))).toEqual([0.9, 0.98]);
    expect([historyScore(0, true, true), historyScore(1, true, true)]).toEqual([0.99, 1]);
    expect(historyScore(1, true, false)).toBeCloseTo(0.85, 10);
    expect(historyScore(1, false, true)).toBeCloseTo(0.81, 10);
    expect(history.lowest).toBeCloseTo(0.735, 10);
    expect([descriptionScore(0.3), descriptionScore(1)].map((s) => Number(s.toFixed(10)))).toEqual([0.42, 0.7]);
    expect([tradeWordScore(1), tradeWordScore(3), tradeWordScore(7)].map((s) => Number(s.toFixed(10)))).toEqual([0.3, 0.4, 0.4]);
  });
});
