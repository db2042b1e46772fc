// Pattern helpers for the repositories' search filters.

/** LIKE with the user's text taken literally. */
export function containsPattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}
