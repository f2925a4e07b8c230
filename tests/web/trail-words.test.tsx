import { describeValue } from '@/components/audits/looks';

/** The trail shows stored values in words, never as JSON punctuation. */
describe('trail values in words', () => {
  test('audit settings read as key–value pairs with lists joined by commas', () => {
    const settings = JSON.stringify({ convention: 'in', ladder: { from: 2, to: 7, step: 0.5 }, signs: ['plus', 'minus'], tolerance: 0.01 });
    const words = describeValue(settings);
    expect(words).toBe('convention in · ladder from 2, to 7, step 0.5 · signs plus, minus · tolerance 0.01');
    expect(words).not.toMatch(/[{}[\]"]/);
  });

  test('plain values, nulls and text that is not JSON pass through', () => {
    expect(describeValue(null)).toBe('—');
    expect(describeValue('null')).toBe('—');
    expect(describeValue('"accept"')).toBe('accept');
    expect(describeValue('in-review')).toBe('in-review');
    expect(describeValue(JSON.stringify({ kind: 'monitor', note: null }))).toBe('kind monitor · note —');
  });
});
