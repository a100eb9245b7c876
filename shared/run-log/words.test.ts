import { describe, expect, it } from 'vitest';
import { ROLE_NOUN, withArticle } from './words';

describe('withArticle', () => {
  it('writes "an" before a vowel and "a" before a consonant', () => {
    expect(withArticle(ROLE_NOUN.air)).toBe('an air');
    expect(withArticle(ROLE_NOUN.part)).toBe('a part thermocouple');
    expect(withArticle('ignored column')).toBe('an ignored column');
    expect(withArticle('vacuum')).toBe('a vacuum');
  });
});
