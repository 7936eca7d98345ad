/** Lower-case, accents removed, punctuation turned into single spaces: the form search compares. */
export function normaliseSearchText(s: string): string {
  return s
    .normalize('NFD')
    .replace(/\p{M}+/gu, '')
    .toLowerCase()
    .replace(/[^\p{L}\p{N}]+/gu, ' ')
    .trim();
}

// Words that mark a plain form of a food: it ranks before variants of the same food.
const PLAIN = /\b(raw|fresh|ripe|whole|plain|regular|unenriched|enriched|fluid)\b/;
// Words that mark a prepared or processed variant, a mixture or a product that merely contains the food.
const PROCESSED =
  /\b(cooked|boiled|fried|roasted|baked|canned|dried|dehydrated|powder|oil|bars?|coated|powdered|flour|juice|frozen|sweetened|syrup|chips|candied|pickled|toasted|stewed|microwaved|prepared|mix|bread|cake|cakes|pie|sauce|drink|beverage|flakes|puffed|instant|fast foods|restaurant|babyfood|infant|formula|snacks?|candies|cookies|crackers|dessert|imitation|substitute|nuggets|frankfurter|sausage|flavored|school lunch|usda commodity|industrial)\b/;

/**
 * Search columns for a food: its normalised name, the name plus aliases, and a rank penalty:
 * 0 plain raw forms, 1 other forms, 2 processed variants and mixtures, +2 for a branded product.
 */
export function searchKeys(name: string, altNames: string[], opts: { branded?: boolean } = {}): { nameKey: string; searchText: string; rankPenalty: number } {
  const nameKey = normaliseSearchText(name);
  const searchText = normaliseSearchText([name, ...altNames].join(' '));
  let rankPenalty = 1;
  if (PLAIN.test(nameKey)) rankPenalty = 0;
  if (PROCESSED.test(nameKey)) rankPenalty = 2;
  if (opts.branded) rankPenalty += 2;
  return { nameKey, searchText, rankPenalty };
}
