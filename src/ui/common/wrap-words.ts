/** Splits `text` at spaces into pieces of at most `width` cells (a word longer than `width` is cut). */
export function wrapWords(text: string, width: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const word of text.split(' ')) {
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
