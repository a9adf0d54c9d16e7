import { describe, expect, it } from 'vitest';
import { readMeanSquareErrors } from '../../src/scan/meanSquareError.js';
import { normaliseText } from '../../src/scan/normalise.js';

const read = (text: string) => readMeanSquareErrors(normaliseText(text)).map((e) => ({ value: e.value.value, text: e.text }));

describe('printed mean squared errors', () => {
  it('reads the usual spellings with their value and text', () => {
    expect(read('F(2, 57) = 4.21, MSE = 0.87, p = .020')).toEqual([{ value: 0.87, text: 'MSE = 0.87' }]);
    expect(read('MSe = 3.10; MS_error = 12.4; MS error = .5; MS(error) = 1,204.5')).toEqual([
      { value: 3.1, text: 'MSe = 3.10' },
      { value: 12.4, text: 'MS_error = 12.4' },
      { value: 0.5, text: 'MS error = .5' },
      { value: 1204.5, text: 'MS(error) = 1,204.5' },
    ]);
  });
  it('maps offsets to the original text', () => {
    const text = 'Groups differed, F(2, 57) = 4.21, MSE\u00a0=\u00a00.87.';
    const [error] = readMeanSquareErrors(normaliseText(text));
    expect(text.slice(error!.start, error!.end)).toBe('MSE\u00a0=\u00a00.87');
  });
  it('leaves alone other mean squares and words', () => {
    expect(read('MS_between = 4.2, RMSE = 0.87, MSEs were small, AMS = 3, MSE = 0')).toEqual([]);
  });
});
