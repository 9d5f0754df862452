import { checkWholeNumber } from './check-whole-number';

/**
 * Every Lyndon word over the symbols 0…k−1 of length 1…maxLength, in lexicographic order, by the
 * Fredricksen–Kessler–Maiorana successor rule (Fredricksen & Maiorana 1978; Duval 1988): increment the last
 * symbol, extend periodically to maxLength, drop trailing (k − 1)s. Each yielded word is a fresh array.
 * k ≥ 1, maxLength ≥ 1. Constant amortised time per word.
 */
export function* lyndonWords(k: number, maxLength: number): Generator<number[], void, undefined> {
  checkWholeNumber('k', k, 1);
  checkWholeNumber('maxLength', maxLength, 1);
  const word: number[] = [-1];
  while (word.length > 0) {
    word[word.length - 1] = (word[word.length - 1] as number) + 1;
    yield word.slice();
    // Extend periodically with the word's own prefix of period `period`.
    const period = word.length;
    while (word.length < maxLength) word.push(word[word.length - period] as number);
    // Strip the largest symbols; what remains is incremented on the next pass.
    while (word.length > 0 && word[word.length - 1] === k - 1) word.pop();
  }
}
