// Small helpers for messages in English: one place for the article so no message reads "a air column".

/** "an air", "a tool", "an hour"-style exceptions aside: the article follows the first letter's vowel sound. */
export function withArticle(noun: string): string {
  return `${/^[aeiou]/i.test(noun) ? 'an' : 'a'} ${noun}`;
}

/** What a column of each channel role is called in messages. */
export const ROLE_NOUN = { air: 'air', tool: 'tool', part: 'part thermocouple', pressure: 'pressure', vacuum: 'vacuum' } as const;
