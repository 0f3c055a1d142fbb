// Axis labels of the bar chart: a long shop name goes on lines of whole words instead of off the canvas.
import { wrapLabel } from './bar-chart';

describe('wrapLabel', () => {
  it('puts whole words on lines of at most the width', () => {
    expect(wrapLabel('MERIDIAN COOLING WORKS', 14)).toEqual(['MERIDIAN', 'COOLING WORKS']);
    expect(wrapLabel('Safety and track inspection', 14)).toEqual(['Safety and', 'track', 'inspection']);
  });

  it('keeps a short name on one line and a word longer than the width whole', () => {
    expect(wrapLabel('Fuel', 14)).toEqual(['Fuel']);
    expect(wrapLabel('COPPERLINEAUTOSUPPLY co', 14)).toEqual(['COPPERLINEAUTOSUPPLY', 'co']);
    expect(wrapLabel('', 14)).toEqual(['']);
  });
});
