// unknownVariant: the entry names a variant the library does not hold.

import type { LibraryRule } from './rule';

export const unknownVariant: LibraryRule = {
  kind: 'library',
  id: 'unknownVariant',
  describe: (variantId) => `no variant "${variantId}" in the library`,
};
