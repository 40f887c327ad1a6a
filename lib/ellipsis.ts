/**
 * `text` cut to its first `length` characters and marked "…": back to the last word's end when
 * one lies after `wordEndAfter` (and the cut is not at one already), without the spaces and
 * punctuation the cut leaves at its end. Used where a name or text is shortened to a box.
 */
export function cutWithEllipsis(text: string, length: number, wordEndAfter: number): string {
  let cut = text.slice(0, length);
  const space = cut.lastIndexOf(' ');
  if (text[cut.length] !== ' ' && space > wordEndAfter) cut = cut.slice(0, space);
  return `${cut.replace(/[\s,;:·–—-]+$/, '')}…`;
}
