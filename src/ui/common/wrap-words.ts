/** A unit after a number ("V", "mA", "%", "kΩ", "V,", or "V..27.2" opening a range): kept on the number's line. */
const UNIT = /^[A-Za-zµΩ°%]{1,3}([,.;:)]*|\.\..*)$/;

/**
 * Splits `text` at spaces into pieces of at most `width` cells (a word longer than `width` is cut).
 * A unit never starts a line away from its number: "27.23 V" and "26.48 V..27.23 V" wrap as one word.
 */
export function wrapWords(text: string, width: number): string[] {
  const words: string[] = [];
  for (const word of text.split(' ')) {
    const last = words.length - 1;
    if (last >= 0 && UNIT.test(word) && /\d$/.test(words[last])) words[last] += ` ${word}`;
    else words.push(word);
  }
  const out: string[] = [];
  let line = '';
  for (const word of words) {
    const next = line ? `${line} ${word}` : word;
    if ([...next].length <= width) line = next;
    else {
      if (line) out.push(line);
      line = [...word].length > width ? [...word].slice(0, width).join('') : word;
    }
  }
  out.push(line);
  return out;
}
