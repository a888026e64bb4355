/** A list in words for a sentence: "a, b or c" (used to name a value list in a message). */
export function wordsOr(values: readonly string[]): string {
  if (values.length <= 1) return values.join('')
  return `${values.slice(0, -1).join(', ')} or ${values.at(-1)}`
}

/** A word with its first letter in capitals, for labels: "valid" → "Valid". */
export function capitalised(word: string): string {
  return word.charAt(0).toUpperCase() + word.slice(1)
}
